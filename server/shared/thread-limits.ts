// How long a thread message may be. Apart from socket-events.ts (the schemas) so the composer can
// count characters without loading zod.
export const MESSAGE_MAX = 5000;
