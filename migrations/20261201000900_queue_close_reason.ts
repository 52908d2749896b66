import type { Knex } from 'knex'

// A supervisor's reason for closing a queue item without a visit gets its own column; it used to be
// written over the snooze reason. Reasons already stored that way move across where the audit log's
// close entry for that item shows the same words; anything else in snooze_reason stays where it is.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('queue_items', (t) => {
    t.string('close_reason', 255)
  })
  // Two statements: a multi-table UPDATE does not promise the order of its assignments.
  await knex.raw(`
    update queue_items q
    join audit_log a on a.entity = 'queue_item' and a.action = 'close' and a.entity_id = q.id
    set q.close_reason = q.snooze_reason
    where q.state = 'closed' and q.snooze_reason = json_unquote(json_extract(a.details, '$.reason'))`)
  await knex.raw(`
    update queue_items set snooze_reason = null
    where state = 'closed' and close_reason is not null and snooze_reason = close_reason`)
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    update queue_items set snooze_reason = close_reason
    where close_reason is not null and snooze_reason is null`)
  await knex.schema.alterTable('queue_items', (t) => {
    t.dropColumn('close_reason')
  })
}
