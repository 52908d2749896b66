import type { Knex } from 'knex'

// Counters for sign-in, public report and status-lookup limits, shared by every app process and kept
// across restarts. The columns, their order and the key are the ones rate-limiter-flexible's MySQL
// store writes (it inserts positional VALUES (key, points, expire)); it is told the table exists.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('key', 255).notNullable().primary()
    t.integer('points').notNullable().defaultTo(0)
    t.bigInteger('expire').unsigned() // epoch milliseconds
    t.index(['expire'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limits')
}
