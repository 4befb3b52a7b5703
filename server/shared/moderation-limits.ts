// How long a report's reason may be. Apart from steward-schemas.ts so the thread's "Report this
// message" can show the limit without loading zod.
export const REASON_MAX = 500;

/** How long a steward's reason for taking a field note out of the Field Library may be. */
export const LIBRARY_HOLD_REASON_MAX = 500;
