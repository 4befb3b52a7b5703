import type { BatchView } from '@shared/case-schemas';
import { OPEN_STATUSES } from '@shared/case-status';

/** The batch's cases still being worked on (from GET /api/batches/:id's `cases`), newest first. */
export function openCasesOf(batch: BatchView): NonNullable<BatchView['cases']> {
  return (batch.cases ?? []).filter((c) => OPEN_STATUSES.includes(c.status));
}
