// Room names. A case has two: everyone allowed to read it, and its mentors and stewards, who
// alone receive asides and aside typing. Every socket is also in its user's room and its
// session's room, so a sign-out or a disabled account reaches exactly the right sockets.
export const caseRoom = (caseId: number) => `case:${caseId}`;
export const caseStaffRoom = (caseId: number) => `case:${caseId}:staff`;
export const userRoom = (userId: number) => `user:${userId}`;
export const sessionRoom = (sid: string) => `sid:${sid}`;
/** every mentor and steward socket: the rounds table hears `case:updated` here */
export const STAFF_ROOM = 'staff';

const CASE_ROOM = /^case:(\d+)$/;
export function caseIdOfRoom(room: string): number | null {
  const match = CASE_ROOM.exec(room);
  return match ? Number(match[1]) : null;
}
