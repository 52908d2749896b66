import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reports', (t) => {
    t.increments('id')
    t.string('ref', 12).notNullable().unique() // LW-XXXXX
    t.integer('string_id').unsigned().references('strings.id').onDelete('SET NULL')
    t.string('tag_text', 60)
    t.string('street_text', 160)
    t.string('landmark', 160)
    t.string('description', 2000).notNullable()
    t.boolean('hazard').notNullable().defaultTo(false) // hanging cable, sparking, exposed wiring
    t.decimal('lat', 9, 6)
    t.decimal('lng', 9, 6)
    t.string('reporter_name', 120)
    t.string('reporter_email', 190)
    t.enum('state', ['received', 'in_hand', 'fixed', 'not_ours', 'duplicate'])
      .notNullable()
      .defaultTo('received')
    t.string('public_note', 500)
    t.string('source_hash', 64) // hashed client address for abuse limits, never the address itself
    t.timestamps(true, true)
  })
  await knex.schema.createTable('certificates', (t) => {
    t.increments('id')
    t.enum('kind', [
      'platform_exam',
      'platform_pre_use',
      'column_structural',
      'anchor_test',
      'display_inspection',
      'rcd_test',
      'insulation_test',
    ]).notNullable()
    t.enum('subject_type', ['platform', 'structure', 'string', 'circuit']).notNullable()
    t.integer('subject_id').unsigned().notNullable()
    t.string('reference', 60)
    t.date('done_on').notNullable()
    t.date('next_due')
    t.enum('result', ['pass', 'fail', 'advisory']).notNullable()
    t.string('inspector', 120)
    t.json('readings') // e.g. RCD trip ms at 1×/5×, insulation MΩ, proof load kN, SWL
    t.string('notes', 1000)
    t.string('file_name', 80)
    t.integer('created_by').unsigned().references('users.id')
    t.timestamps(true, true)
    t.index(['subject_type', 'subject_id'])
    t.index(['next_due'])
  })
  await knex.schema.createTable('queue_items', (t) => {
    t.increments('id')
    t.enum('kind', [
      'replace_now',
      'dark',
      'forecast_dark',
      'public_report',
      'certificate_due',
      'rcd_failed',
    ]).notNullable()
    t.string('open_key', 80).unique() // kind:subject while open; null once closed, so one open item each
    t.integer('string_id').unsigned().references('strings.id').onDelete('CASCADE')
    t.integer('report_id').unsigned().references('reports.id').onDelete('CASCADE')
    t.integer('certificate_id').unsigned().references('certificates.id').onDelete('CASCADE')
    t.integer('site_id').unsigned().references('sites.id').onDelete('CASCADE')
    t.integer('client_id').unsigned().references('clients.id').onDelete('CASCADE')
    t.enum('severity', ['emergency', 'standard']).notNullable()
    t.enum('state', ['open', 'snoozed', 'closed', 'merged']).notNullable().defaultTo('open')
    t.dateTime('opened_at').notNullable()
    t.dateTime('due_by').notNullable()
    t.dateTime('snoozed_until')
    t.string('snooze_reason', 255)
    t.integer('merged_into_id').unsigned().references('queue_items.id').onDelete('SET NULL')
    t.dateTime('closed_at')
    t.integer('closed_by_visit_id').unsigned().references('visits.id').onDelete('SET NULL')
    t.decimal('score', 8, 3).notNullable().defaultTo(0)
    t.json('score_parts')
    t.string('summary', 255).notNullable()
    t.timestamps(true, true)
    t.index(['state', 'due_by'])
  })
  await knex.schema.createTable('runs', (t) => {
    t.increments('id')
    t.integer('crew_id').unsigned().notNullable().references('crews.id').onDelete('CASCADE')
    t.date('run_date').notNullable()
    t.enum('state', ['draft', 'published']).notNullable().defaultTo('draft')
    t.integer('version').notNullable().defaultTo(1)
    t.dateTime('published_at')
    t.integer('published_by').unsigned().references('users.id')
    t.integer('total_travel_minutes')
    t.integer('total_service_minutes')
    t.string('return_at', 5)
    t.timestamps(true, true)
    t.unique(['crew_id', 'run_date'])
  })
  await knex.schema.createTable('run_stops', (t) => {
    t.increments('id')
    t.integer('run_id').unsigned().notNullable().references('runs.id').onDelete('CASCADE')
    t.integer('position').notNullable()
    t.integer('queue_item_id').unsigned().references('queue_items.id').onDelete('SET NULL')
    t.integer('string_id').unsigned().references('strings.id').onDelete('SET NULL')
    t.string('arrive_at', 5)
    t.string('start_at', 5)
    t.string('depart_at', 5)
    t.integer('travel_minutes')
    t.integer('service_minutes')
    t.boolean('pinned').notNullable().defaultTo(false)
    t.dateTime('done_at')
    t.unique(['run_id', 'position'])
  })
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ['run_stops', 'runs', 'queue_items', 'certificates', 'reports'])
    await knex.schema.dropTable(t)
}
