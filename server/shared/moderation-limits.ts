// How long a report's reason may be. Apart from steward-schemas.ts so the thread's "Report this
// message" can show the limit without loading zod.
export const REASON_MAX = 500;
