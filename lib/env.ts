import { z } from 'zod';

// Validated once at start-up: a missing or malformed setting fails loudly here, not deep in a request.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().positive().default(3406),
  DB_NAME: z.string().min(1).default('scribeline'),
  DB_USER: z.string().min(1).default('scribeline'),
  DB_PASSWORD: z.string().default('scribeline-local'),
  DB_POOL_MAX: z.coerce.number().int().positive().default(10),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  NEXTAUTH_URL: z.string().url().optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (!cached) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
      throw new Error(`Bad environment settings:\n${lines.join('\n')}`);
    }
    cached = parsed.data;
  }
  return cached;
}
