import type { Knex } from 'knex'

// The estate becomes editable in the app: every kind gets a version for optimistic locking and an
// archive date (rows with history are never deleted), plus the client and asset fields the forms take.
const kinds = [
  'clients',
  'sites',
  'supply_points',
  'circuits',
  'structures',
  'string_types',
  'strings',
  'crews',
  'platforms',
]

export async function up(knex: Knex): Promise<void> {
  for (const table of kinds)
    await knex.schema.alterTable(table, (t) => {
      t.integer('version').notNullable().defaultTo(1)
      t.dateTime('archived_at')
    })
  await knex.schema.alterTable('clients', (t) => {
    t.string('time_zone', 64).notNullable().defaultTo('Europe/London')
    t.enum('switch_mode', ['fixed', 'dusk']).notNullable().defaultTo('fixed')
    t.integer('dusk_offset_minutes').notNullable().defaultTo(0)
    t.string('emergency_phone', 40)
  })
  await knex.schema.alterTable('structures', (t) => {
    t.string('approval_ref', 60)
    t.date('approval_expires')
  })
  await knex.schema.alterTable('strings', (t) => {
    t.decimal('mounting_height_m', 5, 2)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('strings', (t) => {
    t.dropColumn('mounting_height_m')
  })
  await knex.schema.alterTable('structures', (t) => {
    t.dropColumn('approval_ref')
    t.dropColumn('approval_expires')
  })
  await knex.schema.alterTable('clients', (t) => {
    t.dropColumn('time_zone')
    t.dropColumn('switch_mode')
    t.dropColumn('dusk_offset_minutes')
    t.dropColumn('emergency_phone')
  })
  for (const table of kinds)
    await knex.schema.alterTable(table, (t) => {
      t.dropColumn('version')
      t.dropColumn('archived_at')
    })
}
