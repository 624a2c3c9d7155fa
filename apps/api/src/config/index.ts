import { z } from 'zod';

const optionalPort = z.coerce.number().int().min(1).max(65535).optional();

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4301),
  APP_URL: z.url(),
  DATABASE_URL: z.string().startsWith('postgres'),
  SESSION_SECRET: z.string().min(32),
  SMTP_HOST: z.string().min(1),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535),
  SMTP_SECURE: z.stringbool().default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Scrap Relay <no-reply@scrap-relay.invalid>'),
  STRIPE_SECRET_KEY: z.string().startsWith('sk_'),
  STRIPE_WEBHOOK_SECRET: z.string().startsWith('whsec_'),
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: optionalPort,
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  UPLOAD_DIR: z.string().min(1),
  WEB_DIST: z.string().optional(),
  TRUST_PROXY: z.string().optional(),
  SHELF_PAGES_KEPT: z.stringbool().default(true),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SIGN_IN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(5),
  SIGN_IN_LIMIT_PER_IP: z.coerce.number().int().min(1).default(50),
  SIGN_IN_LIMIT_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
});

export type Env = z.infer<typeof envSchema>;

export interface Config {
  env: Env['NODE_ENV'];
  port: number;
  appUrl: string;
  databaseUrl: string;
  sessionSecret: string;
  smtp: { host: string; port: number; secure: boolean; user?: string; password?: string; from: string };
  stripe: { secretKey: string; webhookSecret: string; host?: string; port?: number; protocol?: 'http' | 'https' };
  uploadDir: string;
  webDist?: string;
  trustProxy?: string;
  /** Pages of the shelf kept in PostgreSQL and served again while current (off: every page worked out afresh). */
  shelfPagesKept: boolean;
  logLevel: Env['LOG_LEVEL'];
  signInLimits: { perAccount: number; perIp: number; windowMs: number };
}

/** Parses the environment once at boot; a missing or malformed key stops the process with the key named. */
export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Scrap Relay cannot start; fix these environment variables:\n${problems}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    appUrl: e.APP_URL.replace(/\/$/, ''),
    databaseUrl: e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET,
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, secure: e.SMTP_SECURE, user: e.SMTP_USER, password: e.SMTP_PASSWORD, from: e.MAIL_FROM },
    stripe: {
      secretKey: e.STRIPE_SECRET_KEY,
      webhookSecret: e.STRIPE_WEBHOOK_SECRET,
      host: e.STRIPE_API_HOST,
      port: e.STRIPE_API_PORT,
      protocol: e.STRIPE_API_PROTOCOL,
    },
    uploadDir: e.UPLOAD_DIR,
    webDist: e.WEB_DIST,
    trustProxy: e.TRUST_PROXY,
    shelfPagesKept: e.SHELF_PAGES_KEPT,
    logLevel: e.LOG_LEVEL,
    signInLimits: {
      perAccount: e.SIGN_IN_LIMIT_PER_ACCOUNT,
      perIp: e.SIGN_IN_LIMIT_PER_IP,
      windowMs: e.SIGN_IN_LIMIT_WINDOW_MINUTES * 60_000,
    },
  };
}
