import type { Knex } from 'knex'

// Every circuit's RCD has a type: `general` (no intentional delay) or `S` (time-delayed), judged
// against different trip times (BS EN 61008-1 / 61009-1). Circuits recorded without one are taken as
// general, the common kind on final circuits and the one the old rules assumed; a circuit with no RCD
// keeps rcd_ma null and the type then means nothing.
export async function up(knex: Knex): Promise<void> {
  await knex('circuits').whereNull('rcd_type').update({ rcd_type: 'general' })
  await knex.schema.alterTable('circuits', (t) => {
    t.enum('rcd_type', ['general', 'S']).notNullable().defaultTo('general').alter()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('circuits', (t) => {
    t.enum('rcd_type', ['general', 'S']).nullable().alter()
  })
}
