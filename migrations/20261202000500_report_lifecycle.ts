import type { Knex } from 'knex'

// Public reports hear back: a `scheduled` state (on a published run), a history of states with times
// and the public note, the queue item that carries each report (several reports on one string share
// one item), and hashes of the one-time tokens in e-mailed "erase my address" links.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    "ALTER TABLE reports MODIFY state ENUM('received','in_hand','scheduled','fixed','not_ours','duplicate') NOT NULL DEFAULT 'received'",
  )
  await knex.schema.alterTable('reports', (t) => {
    t.integer('queue_item_id').unsigned().references('queue_items.id').onDelete('SET NULL')
  })
  await knex.schema.createTable('report_events', (t) => {
    t.increments('id')
    t.integer('report_id').unsigned().notNullable().references('reports.id').onDelete('CASCADE')
    t.enum('state', ['received', 'in_hand', 'scheduled', 'fixed', 'not_ours', 'duplicate']).notNullable()
    t.dateTime('at').notNullable()
    t.string('public_note', 500)
    t.index(['report_id', 'at'])
  })
  await knex.schema.createTable('report_email_tokens', (t) => {
    t.increments('id')
    t.integer('report_id').unsigned().notNullable().references('reports.id').onDelete('CASCADE')
    t.string('token_hash', 64).notNullable().unique()
    t.dateTime('created_at').notNullable()
  })
  // Existing reports: each is carried by its own item (the newest one), and its history starts with
  // `received` when it was sent, plus the state it is in now at its last change.
  await knex.raw(`
    update reports r set r.queue_item_id =
      (select max(q.id) from queue_items q where q.kind = 'public_report' and q.report_id = r.id)`)
  await knex.raw(`
    insert into report_events (report_id, state, at, public_note)
    select id, 'received', created_at, null from reports`)
  await knex.raw(`
    insert into report_events (report_id, state, at, public_note)
    select id, state, updated_at, public_note from reports where state <> 'received'`)
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('report_email_tokens')
  await knex.schema.dropTable('report_events')
  await knex.schema.alterTable('reports', (t) => {
    t.dropForeign(['queue_item_id'])
    t.dropColumn('queue_item_id')
  })
  await knex('reports').where({ state: 'scheduled' }).update({ state: 'in_hand' })
  await knex.raw(
    "ALTER TABLE reports MODIFY state ENUM('received','in_hand','fixed','not_ours','duplicate') NOT NULL DEFAULT 'received'",
  )
}
