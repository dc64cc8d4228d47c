import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0'])
  .transform((v) => v === 'true' || v === '1');

/** Every setting Varden reads, parsed once. Nothing else in the API reads process.env. */
const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  /** The address users open in the browser; links in e-mails and the Origin check use it. */
  APP_ORIGIN: z.url().optional(),
  DATABASE_URL: z.string().regex(/^mysql:\/\//, 'DATABASE_URL must be a mysql:// URL'),
  DB_POOL_SIZE: z.coerce.number().int().min(1).max(200).default(20),
  S3_ENDPOINT: z.url().optional(),
  S3_BUCKET: z.string().min(3),
  S3_REGION: z.string().default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  S3_FORCE_PATH_STYLE: bool.default(false),
  SMTP_URL: z.string().regex(/^smtps?:\/\//, 'SMTP_URL must be an smtp:// or smtps:// URL'),
  MAIL_FROM: z.string().default('Varden <no-reply@varden.test>'),
  WEB_DIST_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  JOBS_ENABLED: bool.default(true),
  /** Mounts GET /api/bench/baseline (SELECT 1 behind the usual middleware) for npm run bench; off in production. */
  BENCH_ROUTES: bool.default(false),
  DEMO_PASSWORD: z.string().min(12).default('switchroom-demo-2026'),
  /**
   * Session lifetimes. The defaults follow NIST SP 800-63B's reauthentication limits for
   * AAL2 (ASVS level 2): 30 minutes without activity, 12 hours at most.
   */
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).max(24 * 30).default(12),
  /** Largest photo upload accepted, bytes (a 12 MP phone JPEG is 3–6 MB). */
  PHOTO_MAX_BYTES: z.coerce.number().int().min(1024).max(200 * 1024 * 1024).default(15 * 1024 * 1024),
  /** Largest photo accepted in pixels, against decompression bombs (a 48 MP phone sensor fits). */
  PHOTO_MAX_PIXELS: z.coerce.number().int().min(10_000).max(500_000_000).default(50_000_000),
});

export type Config = z.infer<typeof configSchema>;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Varden's configuration is invalid:\n${problems}`);
  }
  return parsed.data;
}

/** The origin the app is served from, used for links and the cross-site request check. */
export function appOrigin(config: Config): string {
  return config.APP_ORIGIN ?? `http://${config.HOST === '0.0.0.0' ? '127.0.0.1' : config.HOST}:${config.PORT}`;
}
