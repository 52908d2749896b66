import type { Knex } from 'knex'

// The register pages 20,000 strings sorted by any shown column of the strings table: each gets an
// index after `archived_at` (the register shows live strings), so a page's ids are read from the
// index in order, however deep the page, instead of sorting every row.
const sorted = [
  'asset_tag',
  'name',
  'status',
  'lamps_out',
  'installed_on',
  'last_visit_at',
  'forecast_dark_at',
]

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('strings', (t) => {
    for (const c of sorted) t.index(['archived_at', c], `strings_register_${c}_index`)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('strings', (t) => {
    for (const c of sorted) t.dropIndex(['archived_at', c], `strings_register_${c}_index`)
  })
}
