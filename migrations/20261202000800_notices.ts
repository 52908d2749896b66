import type { Knex } from 'knex'

// In-app notices: a short message for one user about something that concerns them (an isolation
// record rejected, a published run changed, a certificate expiring, a report put in their hands).
// Read once opened; `read_at` stays null until then. Removing a user removes their notices.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notices', (t) => {
    t.increments('id')
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.enum('kind', [
      'isolation_rejected',
      'run_changed',
      'certificate_expiring',
      'report_assigned',
    ]).notNullable()
    t.string('title', 200).notNullable()
    t.string('body', 1000)
    t.string('link', 300)
    t.dateTime('created_at').notNullable()
    t.dateTime('read_at')
    t.index(['user_id', 'read_at'])
    t.index(['user_id', 'created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notices')
}
