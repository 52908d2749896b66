import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('platforms', (t) => {
    t.increments('id')
    t.string('name', 120).notNullable()
    t.string('asset_tag', 40).notNullable().unique()
    t.enum('kind', ['scissor', 'boom', 'vehicle_mounted', 'tower']).notNullable()
    t.decimal('working_height_m', 5, 2).notNullable()
    t.integer('safe_working_load_kg').notNullable()
    t.decimal('max_wind_ms', 4, 1).notNullable().defaultTo(12.5)
    t.boolean('active').notNullable().defaultTo(true)
    t.timestamps(true, true)
  })
  await knex.schema.createTable('crews', (t) => {
    t.increments('id')
    t.string('name', 80).notNullable().unique()
    t.string('depot_name', 120).notNullable()
    t.decimal('depot_lat', 9, 6).notNullable()
    t.decimal('depot_lng', 9, 6).notNullable()
    t.string('shift_start', 5).notNullable() // HH:mm local
    t.string('shift_end', 5).notNullable() // may be past midnight: end < start
    t.integer('platform_id').unsigned().references('platforms.id').onDelete('SET NULL')
    t.boolean('active').notNullable().defaultTo(true)
    t.timestamps(true, true)
  })
  await knex.schema.createTable('users', (t) => {
    t.increments('id')
    t.string('email', 190).notNullable().unique()
    t.string('name', 120).notNullable()
    t.enum('role', ['crew', 'supervisor', 'manager', 'safety', 'admin']).notNullable()
    t.string('password_hash', 100)
    t.boolean('active').notNullable().defaultTo(true)
    t.integer('crew_id').unsigned().references('crews.id').onDelete('SET NULL')
    t.string('invite_token_hash', 64).index()
    t.dateTime('invited_at')
    t.dateTime('invite_expires_at')
    t.dateTime('last_sign_in_at')
    t.timestamps(true, true)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users')
  await knex.schema.dropTable('crews')
  await knex.schema.dropTable('platforms')
}
