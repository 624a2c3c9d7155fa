import { describe, expect, it } from 'vitest';
import { toAppError } from './handler.ts';

describe('toAppError', () => {
  it('answers a deadlock or serialisation failure with 503 and a retry, not a 500', () => {
    for (const code of ['40P01', '40001']) {
      const err = Object.assign(new Error('deadlock detected'), { name: 'SequelizeDatabaseError', parent: { code } });
      expect(toAppError(err)).toMatchObject({ status: 503, code: 'service_unavailable' });
    }
  });

  it('keeps what went wrong inside: an unknown error is a 500 without its message', () => {
    const err = toAppError(new Error('relation "secret_table" does not exist'));
    expect(err).toMatchObject({ status: 500, code: 'internal' });
    expect(err.message).not.toContain('secret_table');
  });
});
