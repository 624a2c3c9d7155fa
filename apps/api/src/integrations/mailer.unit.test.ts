import { describe, expect, it } from 'vitest';
import { messageIdFor } from './mailer.ts';

describe('the Message-ID of a queued e-mail (RFC 5322 section 3.6.4: "<" id-left "@" id-right ">")', () => {
  it('is the job id at the sender’s domain, so a second sending of one job is the same message', () => {
    const id = '40de67a8-99eb-4984-bfd5-9a53f2e10465';
    expect(messageIdFor(id, 'Scrap Relay <relay@ferncombe-quilters.example>')).toBe(`<${id}@ferncombe-quilters.example>`);
    expect(messageIdFor(id, 'relay@ferncombe-quilters.example')).toBe(`<${id}@ferncombe-quilters.example>`);
  });

  it('uses a domain reserved for no one when the sender has none (RFC 2606 reserves .invalid)', () => {
    expect(messageIdFor('job-1', 'Scrap Relay')).toBe('<job-1@scrap-relay.invalid>');
  });
});
