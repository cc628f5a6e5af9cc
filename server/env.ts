import { z } from 'zod';

// Every setting the server reads, with the embedded defaults of DESIGN.md's fixed interfaces.
// Parsed once at boot: a bad value stops the process with a message that names the variable.
const port = z.coerce.number().int().min(0).max(65535);

export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: port.default(3000),
  HOST: z.string().min(1).default('127.0.0.1'),
  APP_URL: z.url().optional(),
  DATA_DIR: z.string().min(1).default('./data'),
  PAYMENTS_PORT: port.default(4010),
  MAIL_SMTP_PORT: port.default(1025),
  MAIL_WEB_PORT: port.default(1080),
  MAIL_FROM: z.string().min(3).default('Kitlane <no-reply@kitlane.test>'),
  START_FAKES: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
  SMTP_URL: z.string().optional(),
  STRIPE_SECRET_KEY: z.string().startsWith('sk_', 'must be a Stripe secret key (sk_…)').default('sk_test_kitlane_local'),
  STRIPE_WEBHOOK_SECRET: z.string().startsWith('whsec_', 'must start with whsec_').default('whsec_kitlane_local'),
  STRIPE_PUBLISHABLE_KEY: z.string().startsWith('pk_').optional(),
  STRIPE_API_URL: z.url().optional(),
  DEMO_PASSWORD: z.string().min(10).default('kitlane-demo-pass'),
  SEED_DEMO: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
  LOG_LEVEL: z.enum(['silent', 'error', 'info', 'debug']).default('info'),
  // How long a new message may stay unread before its recipient gets a digest mail (issue 3: 10 minutes).
  MESSAGE_DIGEST_DELAY_MS: z.coerce.number().int().min(100).max(24 * 3600_000).default(10 * 60_000),
});

export type Env = z.infer<typeof envSchema>;

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = envSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new EnvError(`Invalid environment:\n${lines.join('\n')}`);
  }
  return result.data;
}

export class EnvError extends Error {}

export function appUrlOf(env: Env): string {
  return env.APP_URL ?? `http://localhost:${env.PORT}`;
}
