/**
 * Client configuration, parsed once with zod at start-up from Vite's `import.meta.env`.
 * The client is served by the same Express process as the API, so the defaults need no setting.
 */
import { z } from 'zod';

const EnvSchema = z.object({
  MODE: z.string().default('production'),
  DEV: z.boolean().default(false),
  VITE_PHASELOOM_API_BASE: z
    .string()
    .regex(/^\/[A-Za-z0-9/_-]*[^/]$/, 'a same-origin path such as /api, without a trailing slash')
    .default('/api'),
});

function parseEnv(source: Record<string, unknown>) {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`bad client configuration:\n${lines.join('\n')}`);
  }
  return {
    mode: parsed.data.MODE,
    isDev: parsed.data.DEV,
    apiBase: parsed.data.VITE_PHASELOOM_API_BASE,
  };
}

export const env = parseEnv(import.meta.env as Record<string, unknown>);
