import type { Knex } from 'knex'

// The whole season (issue 15): a client's install and take-down windows beside its switch-on and
// switch-off dates (season_start / season_end), each string's season state and store bin, the
// commissioning record (and the pre-season inspection in store, which takes the same readings), the
// take-down record, and the queue's installation and take-down jobs. Each record also writes a visit
// row of its kind, so the field-photo upload (photos.visit_id) carries its photos.
const QUEUE_KINDS = ['replace_now', 'dark', 'forecast_dark', 'public_report', 'certificate_due', 'rcd_failed']
const SEASON_KINDS = ['installation', 'take_down']
const enumSql = (values: string[]) => values.map((v) => `'${v}'`).join(', ')

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clients', (t) => {
    t.date('install_from')
    t.date('install_to')
    t.date('take_down_from')
    t.date('take_down_to')
  })
  await knex.schema.alterTable('strings', (t) => {
    // Strings already on the register are up and lit: they start in service.
    t.enum('season_state', ['in_store', 'installed', 'in_service', 'taken_down', 'needs_repair'])
      .notNullable()
      .defaultTo('in_service')
    t.string('store_bin', 40)
    t.index(['season_state'], 'strings_season_state_index')
  })
  await knex.schema.alterTable('visits', (t) => {
    t.enum('kind', ['visit', 'commissioning', 'store_inspection', 'take_down'])
      .notNullable()
      .defaultTo('visit')
  })
  await knex.raw(
    `alter table queue_items modify kind enum(${enumSql([...QUEUE_KINDS, ...SEASON_KINDS])}) not null`,
  )
  await knex.schema.createTable('commissionings', (t) => {
    t.increments('id')
    t.string('idempotency_key', 64)
      .notNullable()
      .unique({ indexName: 'commissionings_idempotency_key_unique' })
    // commissioning: installed and tested before switch-on; store_inspection: the same readings in store
    t.enum('kind', ['commissioning', 'store_inspection']).notNullable()
    t.integer('string_id').unsigned().notNullable().references('strings.id').onDelete('CASCADE')
    t.integer('visit_id').unsigned().references('visits.id').onDelete('SET NULL')
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.integer('crew_id').unsigned().references('crews.id').onDelete('SET NULL')
    t.dateTime('done_at').notNullable()
    t.integer('structure_id').unsigned().references('structures.id').onDelete('SET NULL')
    t.string('approval_note', 255) // the structural approval it was checked against, in words
    t.enum('place', ['carriageway', 'footway'])
    t.decimal('mounting_height_m', 5, 2)
    t.json('readings') // the certificate readings (RCD trip times, insulation MΩ …)
    t.integer('lamps_out').notNullable().defaultTo(0)
    t.enum('result', ['pass', 'advisory', 'fail']).notNullable()
    t.json('findings') // [{ code, level, text }]
    t.string('notes', 1000)
    t.decimal('lat', 9, 6)
    t.decimal('lng', 9, 6)
    t.timestamps(true, true)
    t.index(['string_id', 'done_at'])
    t.index(['done_at'])
  })
  await knex.schema.createTable('take_downs', (t) => {
    t.increments('id')
    t.string('idempotency_key', 64).notNullable().unique({ indexName: 'take_downs_idempotency_key_unique' })
    t.integer('string_id').unsigned().notNullable().references('strings.id').onDelete('CASCADE')
    t.integer('visit_id').unsigned().references('visits.id').onDelete('SET NULL')
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.integer('crew_id').unsigned().references('crews.id').onDelete('SET NULL')
    t.dateTime('done_at').notNullable()
    t.integer('lamps_out').notNullable().defaultTo(0)
    t.string('damage', 500)
    t.enum('cable', ['good', 'worn', 'damaged']).notNullable()
    t.enum('connectors', ['good', 'worn', 'damaged']).notNullable()
    t.string('store_bin', 40).notNullable()
    t.boolean('for_repair').notNullable().defaultTo(false)
    // Set by the pre-season inspection that cleared it (commissionings.id)
    t.integer('cleared_by_id').unsigned().references('commissionings.id').onDelete('SET NULL')
    t.string('notes', 1000)
    t.timestamps(true, true)
    t.index(['string_id', 'done_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('take_downs')
  await knex.schema.dropTable('commissionings')
  await knex('queue_items').whereIn('kind', SEASON_KINDS).delete()
  await knex.raw(`alter table queue_items modify kind enum(${enumSql(QUEUE_KINDS)}) not null`)
  await knex.schema.alterTable('visits', (t) => {
    t.dropColumn('kind')
  })
  await knex.schema.alterTable('strings', (t) => {
    t.dropIndex(['season_state'], 'strings_season_state_index')
    t.dropColumn('store_bin')
    t.dropColumn('season_state')
  })
  await knex.schema.alterTable('clients', (t) => {
    for (const c of ['install_from', 'install_to', 'take_down_from', 'take_down_to']) t.dropColumn(c)
  })
}
