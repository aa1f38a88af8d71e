import { z } from 'zod';

/**
 * The server's environment, validated once at start. A bad value stops the server with a message
 * that names the variable and what it must look like.
 */
const environmentSchema = z
  .object({
    DATABASE_URL: z
      .string()
      .regex(/^(file:|libsql:\/\/|https?:\/\/|wss?:\/\/)/, 'must start with file:, libsql://, http(s):// or ws(s)://')
      .default('file:./data/lashline.db'),
    DATABASE_AUTH_TOKEN: z.string().min(1).optional(),
    DATA_DIR: z.string().min(1).default('./data'),
    AUTH_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
    PUBLIC_URL: z.url('must be a full URL such as http://localhost:4321').optional(),
    SMTP_HOST: z.string().min(1).optional(),
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
    SMTP_USER: z.string().optional(),
    SMTP_PASS: z.string().optional(),
    SMTP_SECURE: z.enum(['true', 'false']).default('false'),
    MAIL_FROM: z.string().default('Lashline <no-reply@lashline.test>'),
    LASHLINE_DEMO: z.enum(['on', 'off']).default('on'),
    MAIL_CATCHER: z.enum(['on', 'off']).optional(),
    // The caught-mail page of a built server: off unless asked for (a demo on one's own machine).
    MAIL_CATCHER_PAGE: z.enum(['on', 'off']).default('off'),
    // Photos go to an S3-compatible bucket when S3_BUCKET is set, else to DATA_DIR/photos.
    S3_BUCKET: z.string().min(1).optional(),
    S3_ENDPOINT: z.url('must be a full URL such as http://127.0.0.1:9000').optional(),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).default('true'),
    // How many proxies stand in front (each appends to X-Forwarded-For); none: the socket's address is the client's.
    TRUST_PROXY: z.coerce
      .number()
      .int('must be a whole number of proxies')
      .min(0, 'must be 0 or more')
      .max(10, 'must be at most 10')
      .default(0),
    // Hours without a request after which a session ends (beside the 14-day maximum).
    SESSION_IDLE_HOURS: z.coerce.number().positive('must be a number of hours above 0').max(336).default(12),
    NODE_ENV: z.string().optional(),
  })
  .refine((env) => !env.S3_ACCESS_KEY_ID === !env.S3_SECRET_ACCESS_KEY, {
    path: ['S3_SECRET_ACCESS_KEY'],
    message:
      'set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY together, or neither (the SDK then finds credentials itself)',
  });

export type Environment = z.infer<typeof environmentSchema>;

let cached: Environment | undefined;

/** Reads and validates process.env once; throws an error naming each bad variable. */
export function readEnvironment(): Environment {
  if (cached) return cached;
  const parsed = environmentSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Lashline cannot start: the environment has bad values.\n${lines.join('\n')}`);
  }
  cached = parsed.data;
  return cached;
}

/** True when mail goes to the built-in local catcher instead of a real SMTP server. */
export function usesMailCatcher(env: Environment = readEnvironment()): boolean {
  if (env.MAIL_CATCHER) return env.MAIL_CATCHER === 'on';
  return !env.SMTP_HOST;
}
