import { z } from 'zod';

// import.meta.env parsed once. Every variable has a default today; a required one added later
// fails fast here with the list of what is missing.
const EnvSchema = z.object({
  VITE_API_BASE_URL: z
    .string()
    .regex(/^\/|^https?:\/\//, 'VITE_API_BASE_URL: must be a path starting with / or an http(s) URL')
    .default('/api'),
  MODE: z.string().default('development'),
});

function parseEnv(raw: Record<string, unknown>) {
  const parsed = EnvSchema.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid client environment: ${problems}`);
  }
  return { apiBaseUrl: parsed.data.VITE_API_BASE_URL.replace(/\/$/, ''), mode: parsed.data.MODE };
}

export const env = parseEnv(import.meta.env as Record<string, unknown>);
