import { describe, expect, it } from 'vitest';
import { ConfigError, readConfig } from '../src/config.ts';

describe('stand-in environment', () => {
  it('reads the documented variables', () => {
    expect(
      readConfig({
        STRIPE_FAKE_PORT: '4404',
        STRIPE_FAKE_PUBLIC_URL: 'http://127.0.0.1:4404',
        STRIPE_FAKE_WEBHOOK_URL: 'http://127.0.0.1:4401/api/stripe/webhook',
        STRIPE_WEBHOOK_SECRET: 'whsec_local',
      }),
    ).toEqual({
      port: 4404,
      publicUrl: 'http://127.0.0.1:4404',
      webhookUrl: 'http://127.0.0.1:4401/api/stripe/webhook',
      webhookSecret: 'whsec_local',
    });
  });

  it('defaults the public URL to the loopback address and leaves webhooks off without a URL', () => {
    expect(readConfig({ STRIPE_FAKE_PORT: '4304', STRIPE_WEBHOOK_SECRET: 'whsec_local' })).toMatchObject({
      publicUrl: 'http://127.0.0.1:4304',
      webhookUrl: undefined,
    });
  });

  it('names every missing or malformed variable at once', () => {
    let error: unknown;
    try {
      readConfig({ STRIPE_FAKE_WEBHOOK_URL: 'not a url' });
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(ConfigError);
    const problems = (error as ConfigError).problems.join('\n');
    expect(problems).toContain('STRIPE_FAKE_PORT is not set');
    expect(problems).toContain('STRIPE_WEBHOOK_SECRET is not set');
    expect(problems).toContain('STRIPE_FAKE_WEBHOOK_URL must be an http(s) URL');
  });

  it('refuses a secret that is not a whsec_ endpoint secret', () => {
    expect(() => readConfig({ STRIPE_FAKE_PORT: '4404', STRIPE_WEBHOOK_SECRET: 'sk_test_oops' })).toThrow(/must start with "whsec_"/);
  });
});
