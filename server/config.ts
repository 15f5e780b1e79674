import { z } from 'zod';

// All configuration comes from the environment; every value has a working local default.
const Env = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(8329),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_URL: z.string().default('postgres://postgres@127.0.0.1:54329/jigwright'),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).default(10),
  S3_ENDPOINT: z.string().default('127.0.0.1'),
  S3_PORT: z.coerce.number().int().default(9329),
  S3_USE_SSL: z.enum(['true', 'false']).default('false'),
  S3_ACCESS_KEY: z.string().default('S3RVER'),
  S3_SECRET_KEY: z.string().default('S3RVER'),
  S3_REGION: z.string().default('us-east-1'),
  S3_BUCKET: z.string().default('jigwright'),
  SMTP_URL: z.string().default('smtp://127.0.0.1:2529'),
  MAIL_FROM: z.string().default('Jigwright <no-reply@jigwright.invalid>'),
  SESSION_SECRET: z.string().default('dev-only-secret-change-me-0123456789abcdef'),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(10),
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1024).default(20 * 1024 * 1024),
  // A shop archive (server/archive) holds every revision's files: it may be far larger than one upload.
  ARCHIVE_MAX_BYTES: z.coerce.number().int().min(1024).default(2 * 1024 * 1024 * 1024),
  // What an imported archive may unpack to (a guard against decompression bombs).
  ARCHIVE_MAX_UNPACKED_BYTES: z.coerce.number().int().min(1024).default(8 * 1024 * 1024 * 1024),
  WEB_DIST: z.string().default('dist'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  NODE_ENV: z.string().default('development'),
  RATE_LIMIT_DISABLED: z.enum(['true', 'false']).default('false'),
});

export type Config = ReturnType<typeof loadConfig>;

export function loadConfig(env: Record<string, string | undefined> = process.env) {
  const parsed = Env.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const secret = new TextEncoder().encode(e.SESSION_SECRET);
  // HS256 needs a secret of at least 32 bytes; jose does not enforce it.
  if (secret.byteLength < 32) throw new Error('SESSION_SECRET must be at least 32 bytes long');
  return {
    port: e.PORT,
    host: e.HOST,
    publicUrl: e.PUBLIC_URL ?? `http://127.0.0.1:${e.PORT}`,
    databaseUrl: e.DATABASE_URL,
    databasePoolMax: e.DATABASE_POOL_MAX,
    objects: {
      endPoint: e.S3_ENDPOINT,
      port: e.S3_PORT,
      useSSL: e.S3_USE_SSL === 'true',
      accessKey: e.S3_ACCESS_KEY,
      secretKey: e.S3_SECRET_KEY,
      region: e.S3_REGION,
      bucket: e.S3_BUCKET,
    },
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    sessionSecret: secret,
    bcryptCost: e.BCRYPT_COST,
    uploadMaxBytes: e.UPLOAD_MAX_BYTES,
    archiveMaxBytes: e.ARCHIVE_MAX_BYTES,
    archiveMaxUnpackedBytes: e.ARCHIVE_MAX_UNPACKED_BYTES,
    webDist: e.WEB_DIST,
    logLevel: e.LOG_LEVEL,
    production: e.NODE_ENV === 'production',
    rateLimitDisabled: e.RATE_LIMIT_DISABLED === 'true',
  };
}
