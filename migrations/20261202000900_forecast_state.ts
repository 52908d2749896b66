import type { Knex } from 'knex'

// The queue refresh becomes incremental (issue 13): each string keeps the key of the inputs its
// stored forecast came from, when it was made, and the forecast's chance-of-dark curve, so the queue
// can re-judge it as time passes without a new simulation and re-forecast only what changed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('strings', (t) => {
    // sha1 of the forecast's inputs (server/jobs/forecast-key.ts); null: never forecast
    t.string('forecast_key', 40)
    t.dateTime('forecast_at')
    // JSON [[burning hours, chance of dark by then], …] from forecast_at (server/jobs/forecast-curve.ts)
    t.text('forecast_curve')
    // the curve is above zero somewhere: only these (and risk-flagged strings) are re-judged each refresh
    t.boolean('forecast_watch').notNullable().defaultTo(false)
    t.index(['forecast_watch'], 'strings_forecast_watch_index')
  })
  // The refresh finds strings out of step with their items by string, kind and state.
  await knex.schema.alterTable('queue_items', (t) => {
    t.index(['string_id', 'kind', 'state'], 'queue_items_string_kind_state_index')
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('queue_items', (t) => {
    t.dropIndex(['string_id', 'kind', 'state'], 'queue_items_string_kind_state_index')
  })
  await knex.schema.alterTable('strings', (t) => {
    t.dropIndex(['forecast_watch'], 'strings_forecast_watch_index')
    t.dropColumn('forecast_watch')
    t.dropColumn('forecast_curve')
    t.dropColumn('forecast_at')
    t.dropColumn('forecast_key')
  })
}
