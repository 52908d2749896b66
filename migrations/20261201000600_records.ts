import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id')
    t.dateTime('at').notNullable()
    t.integer('user_id').unsigned().references('users.id').onDelete('SET NULL')
    t.string('action', 60).notNullable()
    t.string('entity', 40).notNullable()
    t.integer('entity_id').unsigned()
    t.json('details')
    t.string('request_id', 40)
    t.index(['entity', 'entity_id'])
    t.index(['at'])
  })
  await knex.schema.createTable('email_outbox', (t) => {
    t.increments('id')
    t.string('to_address', 190).notNullable()
    t.string('subject', 255).notNullable()
    t.text('text').notNullable()
    t.text('html', 'mediumtext')
    t.enum('state', ['queued', 'sent', 'failed']).notNullable().defaultTo('queued')
    t.integer('attempts').notNullable().defaultTo(0)
    t.string('last_error', 500)
    t.string('topic', 40) // invite, run_published, run_changed, report_received
    t.dateTime('sent_at')
    t.timestamps(true, true)
    t.index(['state'])
  })
  await knex.schema.createTable('caught_mail', (t) => {
    t.increments('id')
    t.string('message_id', 255)
    t.string('from_address', 255)
    t.string('to_address', 500)
    t.string('subject', 255)
    t.text('text', 'mediumtext')
    t.text('html', 'mediumtext')
    t.dateTime('received_at').notNullable()
  })
  await knex.schema.createTable('settings', (t) => {
    t.string('key', 60).primary()
    t.json('value').notNullable()
    t.timestamps(true, true)
  })
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ['settings', 'caught_mail', 'email_outbox', 'audit_log']) await knex.schema.dropTable(t)
}
