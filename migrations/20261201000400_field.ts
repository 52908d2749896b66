import type { Knex } from 'knex'

// Safe-isolation steps (Electricity at Work Regulations 1989 regs 12–14; HSE HSG85; GS38),
// then the restoration steps after work.
const steps = [
  'identify',
  'isolate',
  'lock_off',
  'prove_tester',
  'test_dead',
  'reprove_tester',
  'remove_lock',
  're_energise',
  'functional_check',
  'rcd_test',
]

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('isolations', (t) => {
    t.increments('id')
    t.string('idempotency_key', 64).notNullable().unique()
    t.integer('string_id').unsigned().references('strings.id').onDelete('SET NULL')
    t.integer('circuit_id').unsigned().references('circuits.id').onDelete('SET NULL')
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.integer('crew_id').unsigned().references('crews.id').onDelete('SET NULL')
    t.string('lock_id', 60)
    t.string('tester_id', 60)
    t.enum('state', ['open', 'isolated', 'restored', 'abandoned']).notNullable().defaultTo('open')
    t.enum('review', ['pending', 'approved', 'rejected']).notNullable().defaultTo('pending')
    t.integer('reviewed_by').unsigned().references('users.id')
    t.dateTime('reviewed_at')
    t.string('review_note', 500)
    t.dateTime('started_at').notNullable()
    t.dateTime('completed_at')
    t.timestamps(true, true)
    t.index(['review'])
  })
  await knex.schema.createTable('isolation_steps', (t) => {
    t.increments('id')
    t.integer('isolation_id').unsigned().notNullable().references('isolations.id').onDelete('CASCADE')
    t.enum('step', steps).notNullable()
    t.dateTime('done_at').notNullable()
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.string('value', 60) // e.g. RCD trip time in ms, tester serial
    t.string('note', 255)
    t.unique(['isolation_id', 'step'])
  })
  await knex.schema.createTable('visits', (t) => {
    t.increments('id')
    t.string('idempotency_key', 64).notNullable().unique()
    t.integer('string_id').unsigned().notNullable().references('strings.id')
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.integer('crew_id').unsigned().references('crews.id').onDelete('SET NULL')
    t.integer('isolation_id').unsigned().references('isolations.id').onDelete('SET NULL')
    t.string('no_isolation_reason', 255)
    t.dateTime('visited_at').notNullable()
    t.integer('failed_found').notNullable().defaultTo(0)
    t.integer('replaced').notNullable().defaultTo(0)
    t.boolean('fuse_replaced').notNullable().defaultTo(false)
    t.boolean('dark_on_arrival').notNullable().defaultTo(false)
    t.decimal('supply_volts', 7, 2)
    t.decimal('amps', 8, 4)
    t.decimal('cold_ohms', 10, 3)
    t.string('notes', 2000)
    t.integer('lamps_out_before').notNullable()
    t.integer('lamps_out_after').notNullable()
    t.enum('status_after', ['lit', 'watch', 'replace', 'dark', 'safe']).notNullable()
    t.decimal('lat', 9, 6)
    t.decimal('lng', 9, 6)
    t.timestamps(true, true)
    t.index(['string_id', 'visited_at'])
    t.index(['visited_at'])
  })
  await knex.schema.createTable('photos', (t) => {
    t.increments('id')
    t.integer('visit_id').unsigned().notNullable().references('visits.id').onDelete('CASCADE')
    t.string('file_name', 80).notNullable().unique()
    t.string('thumb_name', 80).notNullable()
    t.string('mime', 40).notNullable()
    t.integer('width').notNullable()
    t.integer('height').notNullable()
    t.integer('bytes').notNullable()
    t.dateTime('taken_at')
    t.decimal('lat', 9, 6)
    t.decimal('lng', 9, 6)
    t.integer('user_id').unsigned().notNullable().references('users.id')
    t.timestamps(true, true)
  })
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ['photos', 'visits', 'isolation_steps', 'isolations']) await knex.schema.dropTable(t)
}
