import type { Knex } from 'knex'

// Every keyed write has a UNIQUE index on its Idempotency-Key, so two simultaneous sends store one
// record (visits and isolations have one since 20261201000400).
//
// Photos: one upload may bring several photos under one key, so each gets its place in the upload
// (upload_seq) and the index is (visit, key, place): a repeated upload collides on its first photo.
// Rows stored before are numbered in id order, so this never fails on existing data.
//
// Public reports: a key column the report form may send; reports without one stay as they are.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.smallint('upload_seq').unsigned().notNullable().defaultTo(0)
  })
  await knex.raw(`
    update photos p
    join (
      select id, row_number() over (partition by visit_id, upload_key order by id) - 1 as seq
      from photos where upload_key is not null
    ) n on n.id = p.id
    set p.upload_seq = n.seq`)
  await knex.schema.alterTable('photos', (t) => {
    t.unique(['visit_id', 'upload_key', 'upload_seq'], { indexName: 'photos_upload_key_unique' })
    t.dropIndex(['upload_key'])
  })
  await knex.schema.alterTable('reports', (t) => {
    t.string('idempotency_key', 64).unique({ indexName: 'reports_idempotency_key_unique' })
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('reports', (t) => {
    t.dropUnique(['idempotency_key'], 'reports_idempotency_key_unique')
    t.dropColumn('idempotency_key')
  })
  await knex.schema.alterTable('photos', (t) => {
    t.index(['upload_key'])
    // The unique index served the visit_id foreign key (InnoDB then drops its own index for it).
    t.index(['visit_id'], 'photos_visit_id_foreign')
    t.dropUnique(['visit_id', 'upload_key', 'upload_seq'], 'photos_upload_key_unique')
    t.dropColumn('upload_seq')
  })
}
