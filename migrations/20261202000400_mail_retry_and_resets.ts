import type { Knex } from 'knex'

// Mail that arrives: a message whose sending failed waits for its next attempt (backoff) instead of
// failing for good at once; 'sending' rows carry a lease so a process that died mid-send does not hold
// them forever, and two processes never send the same row twice (the claim is one UPDATE).
// Access recovery: one-time password-reset links, stored only as a hash of the token.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    "ALTER TABLE email_outbox MODIFY state ENUM('queued','sending','sent','failed') NOT NULL DEFAULT 'queued'",
  )
  await knex.schema.alterTable('email_outbox', (t) => {
    t.dateTime('next_attempt_at')
    t.dateTime('claimed_until')
    t.string('claim', 36)
    t.dateTime('last_attempt_at')
    t.index(['state', 'next_attempt_at'])
  })
  // Rows queued before this migration are due now; rows that failed stay failed (old news by now).
  await knex('email_outbox').where({ state: 'queued' }).update({ next_attempt_at: knex.fn.now() })

  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id')
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE')
    t.string('token_hash', 64).notNullable().unique()
    t.dateTime('created_at').notNullable()
    t.dateTime('expires_at').notNullable()
    t.dateTime('used_at')
    t.index(['user_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets')
  await knex.schema.alterTable('email_outbox', (t) => {
    t.dropIndex(['state', 'next_attempt_at'])
    t.dropColumn('next_attempt_at')
    t.dropColumn('claimed_until')
    t.dropColumn('claim')
    t.dropColumn('last_attempt_at')
  })
  await knex('email_outbox').where({ state: 'sending' }).update({ state: 'queued' })
  await knex.raw(
    "ALTER TABLE email_outbox MODIFY state ENUM('queued','sent','failed') NOT NULL DEFAULT 'queued'",
  )
}
