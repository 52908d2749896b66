import type { Knex } from 'knex'

// The phone's Idempotency-Key of the upload that brought a photo, so a repeated upload (sent, but the
// answer was lost to a bad signal) returns the photos already stored instead of storing them twice.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.string('upload_key', 64).index()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.dropIndex(['upload_key'])
    t.dropColumn('upload_key')
  })
}
