// Demo data the seed stores in `settings` and the server shows only in demo mode: the sign-in
// page's accounts and the invented town's drawn streets. The server never imports the seed.
import type { Db } from '../db'
import type { z } from 'zod'
import type { basemap } from '../../shared/schemas/system'
import type { Role } from '../../shared/roles'

export const DEMO_SETTINGS = { accounts: 'demo_accounts', basemap: 'demo_basemap' } as const

export interface DemoAccounts {
  accounts: { email: string; role: Role; name: string }[]
  password: string
}

async function read<T>(db: Db, key: string): Promise<T | null> {
  const row = await db('settings').where({ key }).first('value')
  if (!row) return null
  return (typeof row.value === 'string' ? JSON.parse(row.value) : row.value) as T
}

export const demoAccountsSetting = (db: Db) => read<DemoAccounts>(db, DEMO_SETTINGS.accounts)
export const demoBasemapSetting = (db: Db) => read<z.infer<typeof basemap>>(db, DEMO_SETTINGS.basemap)
