// The embedded cluster's shared_buffers: an eighth of memory, kept between PostgreSQL's own
// default (128 MB, postgresql.conf.sample) and 1 GB; SPOREWELL_PG_SHARED_BUFFERS_MB overrides.
import { afterEach, describe, expect, test } from 'vitest';
import { sharedBuffersMb } from '../../server/src/lib/local-postgres';

const GiB = 2 ** 30;

describe('shared_buffers of the embedded cluster', () => {
  afterEach(() => {
    delete process.env.SPOREWELL_PG_SHARED_BUFFERS_MB;
  });

  test('when the machine has 4 GiB, then it is 512 MB (an eighth)', () => {
    expect(sharedBuffersMb(4 * GiB)).toBe(512);
  });

  test('when the machine is small, then it never goes below the 128 MB default', () => {
    expect(sharedBuffersMb(0.5 * GiB)).toBe(128);
  });

  test('when the machine is large, then it stops at 1 GB', () => {
    expect(sharedBuffersMb(24 * GiB)).toBe(1024);
  });

  test('when SPOREWELL_PG_SHARED_BUFFERS_MB is a whole number of at least 16, then it wins; otherwise it is ignored', () => {
    process.env.SPOREWELL_PG_SHARED_BUFFERS_MB = '256';
    expect(sharedBuffersMb(24 * GiB)).toBe(256);
    process.env.SPOREWELL_PG_SHARED_BUFFERS_MB = 'lots';
    expect(sharedBuffersMb(24 * GiB)).toBe(1024);
    process.env.SPOREWELL_PG_SHARED_BUFFERS_MB = '8';
    expect(sharedBuffersMb(24 * GiB)).toBe(1024);
  });
});
