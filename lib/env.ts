import { z } from 'zod';

/**
 * Environment, validated once. Every variable has a development default except SESSION_SECRET in
 * production. A missing or malformed variable is named in the error.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().url().default('postgres://postgres@127.0.0.1:54329/hearthcast'),
  APP_URL: z.string().url().default('http://127.0.0.1:3000'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  SMTP_URL: z.string().default('smtp://127.0.0.1:2525'),
  MAIL_FROM: z.string().default('Hearthcast <no-reply@example.org>'),
  /** Where the local mail fake keeps messages (and where the dev mailbox page reads them). */
  MAILBOX_DIR: z.string().default('.var/mail'),
  /** Dev-only pages (mailbox, push deliveries). Off by default in production. */
  DEV_TOOLS: z.enum(['0', '1']).optional(),
  /** Cookie Secure flag: on when APP_URL is https unless set. */
  COOKIE_SECURE: z.enum(['0', '1']).optional(),
  /** 1 behind a reverse proxy that appends the client address to X-Forwarded-For (sign-in throttling per address). */
  TRUST_PROXY: z.enum(['0', '1'], { message: 'TRUST_PROXY is 0 or 1' }).default('0'),
  /** Base URL of the Open-Meteo forecast API (or the local fake, the default). */
  FORECAST_URL: z.string().url('FORECAST_URL must be a URL such as https://api.open-meteo.com').default('http://127.0.0.1:4011'),
  /** Optional key of the commercial forecast endpoint, sent as the `apikey` query parameter. */
  FORECAST_API_KEY: z.string().optional(),
  /** UTC hour of the afternoon forecast refresh, on top of the one every 3 hours. */
  FORECAST_AFTERNOON_HOUR_UTC: z.coerce.number().int().min(0, 'FORECAST_AFTERNOON_HOUR_UTC is 0–23').max(23, 'FORECAST_AFTERNOON_HOUR_UTC is 0–23').default(13),
  /** Forecasts whose hours ended longer ago than this are deleted by the refresh job [days]. */
  FORECAST_RETENTION_DAYS: z.coerce.number().int().min(1, 'FORECAST_RETENTION_DAYS is at least 1').max(3650).default(14),
  /** Per-try timeout of a forecast request [ms]. */
  FORECAST_TIMEOUT_MS: z.coerce.number().int().min(100).max(120_000).default(10_000),
  /** PEM certificate of the local push fake; when set, the push sender trusts it (and only then). */
  PUSH_FAKE_CA: z.string().min(1).optional(),
  /** Where the local push fake keeps what it received (read by the dev push page). */
  PUSH_FAKE_DIR: z.string().default('.var/push'),
  /** VAPID key pair (base64url, from `npx web-push generate-vapid-keys`); made on first use and kept in the database when absent. */
  VAPID_PUBLIC_KEY: z.string().regex(/^[A-Za-z0-9_-]{80,100}$/, 'VAPID_PUBLIC_KEY must be a base64url P-256 public key').optional(),
  VAPID_PRIVATE_KEY: z.string().regex(/^[A-Za-z0-9_-]{40,50}$/, 'VAPID_PRIVATE_KEY must be a base64url P-256 private key').optional(),
  /** Contact the push services can reach the sender at (mailto: or https:). */
  VAPID_SUBJECT: z.string().regex(/^(mailto:|https:)/, 'VAPID_SUBJECT must start with mailto: or https:').optional(),
  /** Sensor readings allowed per cooker API key and minute. */
  READINGS_RATE_PER_MIN: z.coerce.number().int().min(1).max(100_000).default(60),
});

export type Env = z.infer<typeof schema> & { sessionSecret: string; devTools: boolean; cookieSecure: boolean };

let cached: Env | null = null;

/** Development-only fallback secret, so a fresh clone signs in without setup. Never used in production. */
const DEV_SECRET = 'hearthcast-development-secret-do-not-use-in-production';

export function getEnv(): Env {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET) {
    throw new Error('Invalid environment:\nSESSION_SECRET: required in production (32+ characters; npm start makes one in .var/session-secret)');
  }
  if (Boolean(e.VAPID_PUBLIC_KEY) !== Boolean(e.VAPID_PRIVATE_KEY)) {
    throw new Error('Invalid environment:\nVAPID_PUBLIC_KEY, VAPID_PRIVATE_KEY: set both or neither (without them a key pair is made and kept in the database)');
  }
  cached = {
    ...e,
    sessionSecret: e.SESSION_SECRET ?? DEV_SECRET,
    devTools: e.DEV_TOOLS ? e.DEV_TOOLS === '1' : e.NODE_ENV !== 'production' || process.env.HEARTHCAST_DEMO === '1',
    cookieSecure: e.COOKIE_SECURE ? e.COOKIE_SECURE === '1' : e.APP_URL.startsWith('https:'),
  };
  return cached;
}
