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
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.PUBLIC_URL) {
      ctx.addIssue({ code: 'custom', path: ['PUBLIC_URL'], message: 'PUBLIC_URL is required in production.' });
    }
    if (env.NODE_ENV === 'production' && !env.SMTP_URL) {
      ctx.addIssue({ code: 'custom', path: ['SMTP_URL'], message: 'SMTP_URL is required in production.' });
    }
  });

export type Env = z.infer<typeof envSchema>;

export interface Config extends Env {
  publicUrl: string;
  secureCookies: boolean;
  /** True when no SMTP_URL is given: a mail catcher on loopback receives the mail. */
  useMailCatcher: boolean;
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
  };
}
