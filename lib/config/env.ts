import { z } from 'zod';

/**
 * The environment, validated once. scripts/env.sh sets every variable for demo and test;
 * production sets its own. Read lazily so that importing a module never fails at build time.
 */
const serverEnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_URL: z.string().url(),
  NEXTAUTH_SECRET: z.string().min(16, 'NEXTAUTH_SECRET must be at least 16 characters'),
  APP_URL: z.string().url(),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535),
  MAIL_FROM: z.string().min(3).default('Branchwise <no-reply@branchwise.invalid>'),
  MAILBOX_DIR: z.string().min(1).optional(),
  DEV_MAIL_PAGE: z.string().optional(),
});

export type ServerEnv = z.infer<typeof serverEnvSchema>;

let cached: ServerEnv | undefined;

function describe(error: z.ZodError): string {
  return error.issues.map((i) => `${i.path.join('.') || '(env)'}: ${i.message}`).join('; ');
}

export function env(): ServerEnv {
  if (cached) return cached;
  const parsed = serverEnvSchema.safeParse({
    ...process.env,
    // APP_URL and NEXTAUTH_URL name the same origin; accept either.
    APP_URL: process.env.APP_URL ?? process.env.NEXTAUTH_URL,
  });
  if (!parsed.success) {
    throw new Error(`Invalid environment (see scripts/env.sh): ${describe(parsed.error)}`);
  }
  cached = parsed.data;
  return cached;
}

/** Only the database URL: the MikroORM CLI and seeds need nothing else. */
export function databaseUrl(): string {
  const parsed = z.string().url().safeParse(process.env.DATABASE_URL);
  if (!parsed.success) {
    throw new Error('DATABASE_URL is missing or not a URL: run `source scripts/env.sh test` (or demo) first');
  }
  return parsed.data;
}

/** The /dev/mail page shows received mail; never in production unless the demo asks for it. */
export function devMailEnabled(): boolean {
  return process.env.NODE_ENV !== 'production' || process.env.DEV_MAIL_PAGE === '1';
}
