import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('string_types', (t) => {
    t.increments('id')
    t.string('code', 30).notNullable().unique()
    t.string('name', 160).notNullable()
    t.enum('technology', ['filament', 'led']).notNullable()
    t.enum('wiring', ['series', 'parallel']).notNullable().defaultTo('series')
    t.integer('supply_volts').notNullable()
    t.integer('rated_life_hours').notNullable()
    t.decimal('life_exponent', 5, 2).notNullable().defaultTo(13)
    t.decimal('weibull_shape', 5, 2).notNullable().defaultTo(2.8)
    t.decimal('replace_at_ratio', 5, 3).notNullable().defaultTo(1.05)
    t.decimal('shunt_fail_probability', 5, 4).notNullable().defaultTo(0.02)
    t.decimal('length_m', 6, 1)
    t.string('notes', 500)
    t.timestamps(true, true)
  })
  await knex.schema.createTable('lamp_classes', (t) => {
    t.increments('id')
    t.integer('string_type_id').unsigned().notNullable().references('string_types.id').onDelete('CASCADE')
    t.integer('position').notNullable()
    t.string('label', 60).notNullable() // "lamp", "fuse lamp"
    t.integer('count').notNullable()
    t.decimal('rated_volts', 7, 3).notNullable()
    t.decimal('rated_amps', 7, 4).notNullable()
    t.boolean('shunted').notNullable()
    t.unique(['string_type_id', 'position'])
  })
  await knex.schema.createTable('strings', (t) => {
    t.increments('id')
    t.string('asset_tag', 40).notNullable().unique()
    t.string('name', 160).notNullable()
    t.integer('type_id').unsigned().notNullable().references('string_types.id')
    t.integer('site_id').unsigned().notNullable().references('sites.id')
    t.integer('circuit_id').unsigned().references('circuits.id').onDelete('SET NULL')
    t.integer('structure_id').unsigned().references('structures.id').onDelete('SET NULL')
    t.enum('geometry', ['point', 'line']).notNullable().defaultTo('point')
    t.decimal('lat', 9, 6).notNullable() // representative point (line midpoint)
    t.decimal('lng', 9, 6).notNullable()
    t.json('line') // [[lng, lat], …] for catenaries and festoons
    t.date('installed_on')
    t.integer('lamp_age_hours').notNullable().defaultTo(0) // burning hours on the lamps at last relamp
    t.integer('lamps_out').notNullable().defaultTo(0) // failed shunted lamps now in the string
    t.boolean('fuse_failed').notNullable().defaultTo(false)
    t.boolean('dark').notNullable().defaultTo(false)
    t.boolean('isolated').notNullable().defaultTo(false)
    t.enum('status', ['lit', 'watch', 'replace', 'dark', 'safe']).notNullable().defaultTo('lit')
    t.boolean('replace_now').notNullable().defaultTo(false)
    t.decimal('max_ratio', 6, 4)
    t.dateTime('forecast_dark_at')
    t.dateTime('last_visit_at')
    t.timestamps(true, true)
    t.index(['lat', 'lng'])
    t.index(['status'])
    t.index(['site_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('strings')
  await knex.schema.dropTable('lamp_classes')
  await knex.schema.dropTable('string_types')
}
