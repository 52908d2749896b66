// `knex seed:run` entry: loads the invented demo town (npm run demo:reset does the same).
import type { Knex } from 'knex'
import { seedDemo } from './demo/index'

export async function seed(knex: Knex): Promise<void> {
  await seedDemo(knex, new Date())
}
