import type { Knex } from 'knex'

// Request ids are either a UUID made by the server or a client's id of at most 64 safe characters
// (server/app.ts); the column holds the longest of them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_log', (t) => {
    t.string('request_id', 64).alter()
  })
}

// Refuses (strict mode) rather than cut ids when longer ones are stored.
export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_log', (t) => {
    t.string('request_id', 40).alter()
  })
}
