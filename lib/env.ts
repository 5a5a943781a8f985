import 'server-only';
import { z } from 'zod';
import { DEFAULT_DATABASE_URL } from '@/db/url';

// The only place that reads server variables. Defaults fit the embedded single-machine setup;
// production points these at managed services without code changes (see README).
const booleanFlag = z
  .enum(['true', 'false', '1', '0', ''])
  .optional()
  .transform((v) => v === 'true' || v === '1');

const serverEnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.url().default(DEFAULT_DATABASE_URL),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  // Where each app copy LISTENs for session changes (lib/auth/actor-cache.ts): a direct connection
  // (a pooler in transaction mode does not deliver notices); `off` reads the signed-in person from
  // the database on every request instead.
  SESSION_NOTICES_URL: z.union([z.literal('off'), z.url()]).optional(),
  S3_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_BUCKET: z.string().min(3).default('rimeline'),
  S3_ACCESS_KEY_ID: z.string().min(1).default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default('S3RVER'),
  S3_FORCE_PATH_STYLE: booleanFlag,
  SMTP_URL: z.url().default('smtp://127.0.0.1:1025'),
  MAIL_FROM: z.string().min(3).default('Rimeline <no-reply@rimeline.test>'),
  MAIL_CATCHER_URL: z.url().optional(),
  APP_URL: z.url().default('http://localhost:3000'),
  // Further public origins for a deployment reachable under several hostnames (comma-separated).
  ALLOWED_ORIGINS: z
    .string()
    .default('')
    .refine((v) => v.split(/[\s,]+/).every((o) => o === '' || URL.canParse(o)), 'ALLOWED_ORIGINS must be a comma-separated list of URLs'),
  // How many reverse proxies append to X-Forwarded-For; 0 means the header is ignored.
  TRUSTED_PROXY_COUNT: z.coerce.number().int().min(0).max(10).default(0),
  AUTH_SECRET: z.string().min(16, 'AUTH_SECRET must be at least 16 characters'),
  DEMO_MODE: booleanFlag,
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type ServerEnv = z.infer<typeof serverEnvSchema>;

function loadEnv(): ServerEnv {
  const parsed = serverEnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment configuration:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

export const env = loadEnv();
