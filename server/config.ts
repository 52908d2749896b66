// The environment, parsed once. Every setting the README lists is read here and nowhere else.
import { z } from 'zod'

const schema = z.object({
  NODE_ENV: z.string().default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DATABASE_URL: z.string().optional(),
  JWT_SECRET: z.string().min(16).optional(),
  SESSION_HOURS: z.coerce.number().positive().default(12),
  DEMO_MODE: z
    .enum(['true', 'false', '1', '0'])
    .default('true')
    .transform((v) => v === 'true' || v === '1'),
  PUBLIC_URL: z.string().optional(),
  SMTP_URL: z.string().optional(),
  SMTP_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAIL_FROM: z.string().default('Lampwright <no-reply@lampwright.example>'),
  TILE_URL: z.string().optional(),
  TILE_ATTRIBUTION: z.string().default('Lampwright demo basemap'),
  TILE_MAX_ZOOM: z.coerce.number().int().min(1).max(22).default(19),
  /** Base URL of an OSRM-compatible routing service for travel times; unset = straight line × detour. */
  ROUTING_URL: z.string().url().optional(),
  UPLOAD_DIR: z.string().default('uploads'),
  UPLOAD_MAX_MB: z.coerce.number().positive().default(12),
  LOG_LEVEL: z.string().default('info'),
})

export type Config = z.infer<typeof schema>

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  return schema.parse(env)
}

export const config: Config = loadConfig()
