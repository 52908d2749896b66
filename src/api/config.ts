import type { z } from 'zod'
import type { clientConfig } from '../../shared/schemas/system'
import { http } from './http'

export type AppConfig = z.infer<typeof clientConfig>
export type DemoAccount = AppConfig['demoAccounts'][number]
export type TileConfig = AppConfig['tiles']

export const configApi = {
  get: () => http.get<AppConfig>('/config'),
}
