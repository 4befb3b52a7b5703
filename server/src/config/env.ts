// The environment, validated once at start-up. A bad setting stops the process with a message
// that names the variable, instead of failing later in some request.
import { z } from 'zod';

const boolish = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no'])
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

export const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    HOST: z.string().min(1).default('127.0.0.1'),
    DATABASE_URL: z
      .string({ error: 'DATABASE_URL is required (npm start sets it for the local cluster).' })
      .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must be a postgres:// URL.'),
    SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters.'),
    SMTP_URL: z
      .string()
      .regex(/^smtps?:\/\//, 'SMTP_URL must be an smtp:// or smtps:// URL.')
      .optional(),
    MAIL_FROM: z.string().default('Sporewell <no-reply@sporewell.example.test>'),
    UPLOAD_DIR: z.string().min(1).default('.data/uploads'),
    PUBLIC_URL: z.url({ error: 'PUBLIC_URL must be a full URL such as https://sporewell.example.test' }).optional(),
    SESSION_IDLE_MINUTES: z.coerce.number().positive().default(3 * 24 * 60),
    SESSION_ABSOLUTE_HOURS: z.coerce.number().positive().default(30 * 24),
    ARGON2_MEMORY_KIB: z.coerce.number().int().min(19456).default(19456),
    TRUST_PROXY: boolish.default(false),
    SEED_DEMO: boolish.optional(),
    LOG_LEVEL: z.enum(['silent', 'error', 'info', 'debug']).default('info'),
    // Photos in an S3-compatible bucket instead of UPLOAD_DIR (several processes or hosts).
    S3_BUCKET: z.string().min(3, 'S3_BUCKET must be a bucket name.').optional(),
    S3_ENDPOINT: z.url({ protocol: /^https?$/, error: 'S3_ENDPOINT must be a full http:// or https:// URL.' }).optional(),
    S3_REGION: z.string().min(1).optional(),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    /** most self-hosted S3-compatible stores want bucket names in the path, not the host */
    S3_FORCE_PATH_STYLE: boolish.optional(),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.PUBLIC_URL) {
      ctx.addIssue({ code: 'custom', path: ['PUBLIC_URL'], message: 'PUBLIC_URL is required in production.' });
    }
    if (env.NODE_ENV === 'production' && !env.SMTP_URL) {
      ctx.addIssue({ code: 'custom', path: ['SMTP_URL'], message: 'SMTP_URL is required in production.' });
    }
    // Half an S3 setting would quietly keep photos on one machine's disk: all of it or none.
    const given = S3_SETTINGS.filter((name) => env[name] !== undefined);
    const missing = S3_REQUIRED.filter((name) => env[name] === undefined);
    if (given.length && missing.length) {
      ctx.addIssue({
        code: 'custom',
        path: [missing[0]],
        message: `S3 photo storage needs ${S3_REQUIRED.join(', ')} together; missing ${missing.join(', ')}. Set them all, or unset every S3_ setting to keep photos in UPLOAD_DIR.`,
      });
    }
  });

const S3_REQUIRED = ['S3_BUCKET', 'S3_ENDPOINT', 'S3_REGION', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const;
const S3_SETTINGS = [...S3_REQUIRED, 'S3_FORCE_PATH_STYLE'] as const;

export type Env = z.infer<typeof envSchema>;

export interface Config extends Env {
  publicUrl: string;
  secureCookies: boolean;
  /** True when no SMTP_URL is given: a mail catcher on loopback receives the mail. */
  useMailCatcher: boolean;
  /** The photo bucket when every S3_ setting is given; null keeps photos in UPLOAD_DIR. */
  s3: S3Settings | null;
}

export interface S3Settings {
  bucket: string;
  endpoint: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
}

export class ConfigError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Sporewell cannot start; fix these settings:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

export function parseConfig(source: Record<string, string | undefined> = process.env): Config {
  // Empty strings in the environment mean "not set".
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = envSchema.safeParse(cleaned);
  if (!parsed.success) {
    throw new ConfigError(parsed.error.issues.map((i) => `${i.path.join('.') || 'environment'}: ${i.message}`));
  }
  const env = parsed.data;
  const publicUrl = (env.PUBLIC_URL ?? `http://localhost:${env.PORT}`).replace(/\/+$/, '');
  return {
    ...env,
    publicUrl,
    secureCookies: publicUrl.startsWith('https://'),
    useMailCatcher: !env.SMTP_URL,
    s3: env.S3_BUCKET
      ? {
          bucket: env.S3_BUCKET,
          endpoint: env.S3_ENDPOINT!,
          region: env.S3_REGION!,
          accessKeyId: env.S3_ACCESS_KEY_ID!,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
          forcePathStyle: env.S3_FORCE_PATH_STYLE ?? false,
        }
      : null,
  };
}
