import { describe, expect, it } from 'vitest';
import { POSTING_WEIGHTS_0304 } from '../../server/src/db/migrations/0304-library-postings';
import { RANKED_FIELDS } from '../../server/src/modules/library/library-ranking';

describe('library postings weights', () => {
  it('when the ranking weights are read, then the postings trigger of migration 0304 uses the same ones', () => {
    // The impact stored per (word, entry) must order entries the way fuse.js will score them;
    // a change of FUSE_OPTIONS weights needs a new migration that rewrites the postings.
    for (const { field, weight } of RANKED_FIELDS) {
      expect(POSTING_WEIGHTS_0304[field]).toBeCloseTo(weight, 12);
    }
    expect(RANKED_FIELDS.map((f) => f.field).sort()).toEqual(Object.keys(POSTING_WEIGHTS_0304).sort());
  });
});
