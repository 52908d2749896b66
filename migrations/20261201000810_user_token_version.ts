import type { Knex } from 'knex'

// Every session token carries the user's token version; bumping it (sign-out, password change, role
// change, deactivation) ends every session the user holds, on every device.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.integer('token_version').unsigned().notNullable().defaultTo(0)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('token_version')
  })
}
