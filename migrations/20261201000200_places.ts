import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('clients', (t) => {
    t.increments('id')
    t.string('name', 160).notNullable().unique()
    t.enum('kind', ['council', 'venue', 'business_district']).notNullable()
    t.string('contact_name', 120)
    t.string('contact_email', 190)
    t.string('contract_ref', 60)
    t.integer('response_emergency_hours').notNullable().defaultTo(24)
    t.integer('response_standard_hours').notNullable().defaultTo(36)
    t.string('switch_on', 5).notNullable().defaultTo('16:00')
    t.string('switch_off', 5).notNullable().defaultTo('23:00')
    t.date('season_start')
    t.date('season_end')
    t.decimal('tariff_per_kwh', 8, 4).notNullable().defaultTo(0.28)
    t.timestamps(true, true)
  })
  await knex.schema.createTable('sites', (t) => {
    t.increments('id')
    t.integer('client_id').unsigned().notNullable().references('clients.id').onDelete('CASCADE')
    t.string('name', 160).notNullable()
    t.enum('kind', ['street', 'square', 'park', 'venue', 'bridge']).notNullable()
    t.integer('importance').notNullable().defaultTo(3) // 1 (low) … 5 (civic centre)
    t.string('access_from', 5) // time window for work on site, HH:mm
    t.string('access_to', 5)
    t.string('access_note', 255)
    t.decimal('lat', 9, 6).notNullable()
    t.decimal('lng', 9, 6).notNullable()
    t.timestamps(true, true)
    t.unique(['client_id', 'name'])
  })
  await knex.schema.createTable('supply_points', (t) => {
    t.increments('id')
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE')
    t.string('ref', 40).notNullable().unique()
    t.string('name', 160).notNullable()
    t.decimal('lat', 9, 6).notNullable()
    t.decimal('lng', 9, 6).notNullable()
    t.string('controlled_by', 40).notNullable().defaultTo('timer') // timer, photocell, remote, manual
    t.timestamps(true, true)
  })
  await knex.schema.createTable('circuits', (t) => {
    t.increments('id')
    t.integer('supply_point_id').unsigned().notNullable().references('supply_points.id').onDelete('CASCADE')
    t.string('ref', 40).notNullable().unique()
    t.integer('supply_volts').notNullable().defaultTo(230)
    t.decimal('breaker_amps', 6, 1).notNullable()
    t.enum('breaker_curve', ['B', 'C', 'D']).notNullable()
    t.integer('rcd_ma')
    t.enum('rcd_type', ['general', 'S'])
    t.timestamps(true, true)
  })
  await knex.schema.createTable('structures', (t) => {
    t.increments('id')
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE')
    t.enum('kind', ['column', 'anchor', 'building_fixing', 'tree', 'gantry']).notNullable()
    t.string('ref', 40).notNullable().unique()
    t.decimal('lat', 9, 6).notNullable()
    t.decimal('lng', 9, 6).notNullable()
    t.string('approved_load', 160) // what the structural approval allows to be hung
    t.timestamps(true, true)
  })
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ['structures', 'circuits', 'supply_points', 'sites', 'clients'])
    await knex.schema.dropTable(t)
}
