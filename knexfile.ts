// Knex settings for the CLI and scripts; the server builds the same settings in server/db.ts.
import { knexConfig } from './server/db'

export default knexConfig(process.env.DATABASE_URL ?? '')
