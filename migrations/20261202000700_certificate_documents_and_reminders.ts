import type { Knex } from 'knex'

// Certificates drive work: the document each certificate was issued as (a PDF or a photo of the
// paper, kept in the file store under a random name; the newest upload is the one shown, older ones
// stay), and the reminders already sent (one row per certificate and stage, so the daily job sends
// each reminder once even when several processes run it).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('certificate_documents', (t) => {
    t.increments('id')
    t.integer('certificate_id').unsigned().notNullable().references('certificates.id').onDelete('CASCADE')
    t.string('file_key', 100).notNullable().unique()
    t.string('original_name', 200).notNullable()
    t.string('content_type', 40).notNullable()
    t.integer('size_bytes').unsigned().notNullable()
    t.integer('uploaded_by').unsigned().references('users.id').onDelete('SET NULL')
    t.dateTime('created_at').notNullable()
    t.index(['certificate_id', 'id'])
  })
  await knex.schema.createTable('certificate_reminders', (t) => {
    t.increments('id')
    t.integer('certificate_id').unsigned().notNullable().references('certificates.id').onDelete('CASCADE')
    t.enum('stage', ['days_30', 'days_14', 'expired']).notNullable()
    t.date('next_due').notNullable()
    t.dateTime('sent_at').notNullable()
    t.integer('recipients').unsigned().notNullable().defaultTo(0)
    t.unique(['certificate_id', 'stage'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('certificate_reminders')
  await knex.schema.dropTable('certificate_documents')
}
