/** Environment of the standalone stand-in, checked once at start. */

export interface StripeFakeConfig {
  port: number;
  publicUrl: string;
  webhookUrl: string | undefined;
  webhookSecret: string;
}

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`stripe-fake cannot start:\n${problems.map((problem) => `  - ${problem}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

function isHttpUrl(value: string): boolean {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

export function readConfig(env: NodeJS.ProcessEnv): StripeFakeConfig {
  const problems: string[] = [];
  const portText = env.STRIPE_FAKE_PORT?.trim() ?? '';
  const port = Number(portText);
  if (portText === '') problems.push('STRIPE_FAKE_PORT is not set (the port to listen on, on 127.0.0.1).');
  else if (!/^\d+$/.test(portText) || port < 1 || port > 65535) problems.push(`STRIPE_FAKE_PORT must be a port number, got "${portText}".`);

  const webhookSecret = env.STRIPE_WEBHOOK_SECRET?.trim() ?? '';
  if (webhookSecret === '') problems.push('STRIPE_WEBHOOK_SECRET is not set (the whsec_… secret events are signed with; the API must use the same).');
  else if (!webhookSecret.startsWith('whsec_')) problems.push('STRIPE_WEBHOOK_SECRET must start with "whsec_", like a Stripe endpoint secret.');

  const publicUrl = env.STRIPE_FAKE_PUBLIC_URL?.trim() || `http://127.0.0.1:${portText}`;
  if (!isHttpUrl(publicUrl)) problems.push(`STRIPE_FAKE_PUBLIC_URL must be an http(s) URL, got "${publicUrl}".`);

  const webhookUrl = env.STRIPE_FAKE_WEBHOOK_URL?.trim() || undefined;
  if (webhookUrl !== undefined && !isHttpUrl(webhookUrl)) problems.push(`STRIPE_FAKE_WEBHOOK_URL must be an http(s) URL, got "${webhookUrl}".`);

  if (problems.length > 0) throw new ConfigError(problems);
  return { port, publicUrl, webhookUrl, webhookSecret };
}
