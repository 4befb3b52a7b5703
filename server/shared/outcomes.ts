// How a case ended, as stored and as a grower reads it. Plain data, so a page that only shows an
// outcome (the Field Library's cards) does not load zod with closing-schemas.ts.
export const OUTCOMES = ['recovered', 'partly', 'lost'] as const;
export type Outcome = (typeof OUTCOMES)[number];
export const OUTCOME_LABELS: Record<Outcome, string> = {
  recovered: 'Recovered',
  partly: 'Partly recovered',
  lost: 'Lost',
};
