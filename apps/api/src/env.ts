// The one place that reads process.env for the API, validated at start.
import { randomBytes } from 'node:crypto';
import { z } from 'zod';

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  /** An existing PostgreSQL server (admin URL); when unset we start a private cluster. */
  DATABASE_URL: z.string().url().optional(),
  /** persistent: data kept per checkout between runs; ephemeral: a throwaway cluster (end-to-end tests). */
  DB_CLUSTER: z.enum(['persistent', 'ephemeral']).default('persistent'),
  DATABASE_NAME: z
    .string()
    .regex(/^[a-z_][a-z0-9_]*$/)
    .default('bumperline'),
  /** Public origin used in e-mailed links. */
  APP_ORIGIN: z.string().url().optional(),
  AUTH_SECRET: z.string().min(32).optional(),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Bumperline <no-reply@bumperline.example>'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Photos are stored here, outside the web root. */
  UPLOADS_DIR: z.string().optional(),
  TWILIO_ACCOUNT_SID: z.string().optional(),
  TWILIO_AUTH_TOKEN: z.string().optional(),
  /** The number (E.164) SMS is sent from. */
  TWILIO_FROM: z.string().default('+13125550199'),
  SEED_DEMO: z.enum(['true', 'false']).default('true'),
});

export type Env = z.infer<typeof schema> & { authSecret: string; appOrigin: string; fakesOn: boolean };

export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const env = schema.parse(source);
  return {
    ...env,
    // Without a configured secret, sessions last as long as this process (fine for a local demo).
    authSecret: env.AUTH_SECRET ?? randomBytes(32).toString('hex'),
    appOrigin: env.APP_ORIGIN ?? `http://${env.HOST}:${env.PORT}`,
    fakesOn: !env.SMTP_URL,
  };
}
