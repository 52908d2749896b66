import type { Knex } from 'knex'

// A visit may record lamps brighter than their neighbours (coils stuck together after a knock: they
// run hot and fail early, trade-reference §2a). Visits logged before this column read as none found.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('visits', (t) => {
    t.integer('bright_lamps').unsigned().notNullable().defaultTo(0)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('visits', (t) => {
    t.dropColumn('bright_lamps')
  })
}
