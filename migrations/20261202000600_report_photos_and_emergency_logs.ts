import type { Knex } from 'knex'

// A public report may carry one photo, sent after the report with a one-time key (only its hash is
// kept on the report, cleared once used). An emergency (hazard) stop can be logged by the crew: what
// they found, what they did and whether it is made safe; the log is kept with the string's history
// even when the item or the string goes, and may carry one photo of its own.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reports', (t) => {
    t.string('photo_key_hash', 64)
  })
  await knex.schema.createTable('report_photos', (t) => {
    t.increments('id')
    t.integer('report_id').unsigned().notNullable().unique().references('reports.id').onDelete('CASCADE')
    t.string('file_name', 80).notNullable().unique()
    t.string('thumb_name', 80).notNullable()
    t.integer('width').notNullable()
    t.integer('height').notNullable()
    t.integer('bytes').notNullable()
    t.dateTime('created_at').notNullable()
  })
  await knex.schema.createTable('emergency_logs', (t) => {
    t.increments('id')
    t.integer('queue_item_id').unsigned().references('queue_items.id').onDelete('SET NULL')
    t.integer('string_id').unsigned().references('strings.id').onDelete('SET NULL')
    t.integer('user_id').unsigned().references('users.id').onDelete('SET NULL')
    t.string('found', 2000).notNullable()
    t.string('did', 2000).notNullable()
    // fixed: safe and nothing left to do; made_safe: safe, needs more work; not_safe: still a hazard.
    t.enum('outcome', ['fixed', 'made_safe', 'not_safe']).notNullable()
    t.dateTime('logged_at').notNullable()
    t.string('idempotency_key', 64).unique({ indexName: 'emergency_logs_idempotency_key_unique' })
    t.string('photo_file', 80)
    t.string('photo_thumb', 80)
    t.string('photo_key', 64).unique({ indexName: 'emergency_logs_photo_key_unique' })
    t.dateTime('created_at').notNullable()
    t.index(['string_id', 'logged_at'])
    t.index(['queue_item_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('emergency_logs')
  await knex.schema.dropTable('report_photos')
  await knex.schema.alterTable('reports', (t) => {
    t.dropColumn('photo_key_hash')
  })
}
