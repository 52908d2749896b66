import type { Knex } from 'knex'

// Lamp and spares stock (issue 15 part 4): items (the lamp classes of the string types, one item per
// lamp rating, and other spares), places that hold them (the depot and one van per crew), a count and
// a low-stock level per item and place, and every movement (transfer, count correction, lamps fitted).
const SPARES = ['Connector (pair)', 'Cable ties (bag of 100)']

/** The item key of a lamp class: rating and whether it carries a shunt (shared/stock-use.ts `lampKey`). */
const lampKey = (v: number, a: number, shunted: boolean) => `lamp:${+v}V:${+a}A:${shunted ? 's' : 'u'}`

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('stock_items', (t) => {
    t.increments('id')
    t.enum('kind', ['lamp', 'spare']).notNullable()
    t.string('name', 120).notNullable()
    t.string('lamp_key', 60).unique() // null for spares
    t.boolean('active').notNullable().defaultTo(true)
    t.timestamps(true, true)
  })
  await knex.schema.createTable('stock_locations', (t) => {
    t.increments('id')
    t.enum('kind', ['depot', 'van']).notNullable()
    t.string('name', 120).notNullable()
    t.integer('crew_id').unsigned().unique().references('crews.id').onDelete('CASCADE')
    t.timestamps(true, true)
  })
  await knex.schema.createTable('stock_levels', (t) => {
    t.integer('location_id').unsigned().notNullable().references('stock_locations.id').onDelete('CASCADE')
    t.integer('item_id').unsigned().notNullable().references('stock_items.id').onDelete('CASCADE')
    t.integer('quantity').notNullable().defaultTo(0) // may go below zero through lamps fitted
    t.integer('low_at') // null: no level set
    t.primary(['location_id', 'item_id'])
  })
  await knex.schema.createTable('stock_movements', (t) => {
    t.bigIncrements('id')
    t.enum('kind', ['transfer', 'adjustment', 'fitted']).notNullable()
    t.integer('item_id').unsigned().notNullable().references('stock_items.id')
    t.integer('from_location_id').unsigned().references('stock_locations.id').onDelete('SET NULL')
    t.integer('to_location_id').unsigned().references('stock_locations.id').onDelete('SET NULL')
    t.integer('quantity').notNullable() // an adjustment's change may be negative
    t.string('reason', 255)
    t.integer('visit_id').unsigned().references('visits.id').onDelete('SET NULL')
    t.integer('string_id').unsigned().references('strings.id').onDelete('SET NULL')
    t.integer('client_id').unsigned().references('clients.id').onDelete('SET NULL')
    t.integer('user_id').unsigned().references('users.id').onDelete('SET NULL')
    t.dateTime('at').notNullable()
    t.index(['kind', 'at'])
    t.index(['visit_id'])
  })

  const now = new Date()
  await knex('stock_locations').insert({ kind: 'depot', name: 'Depot', created_at: now, updated_at: now })
  const crews = await knex('crews').select('id', 'name')
  if (crews.length)
    await knex('stock_locations').insert(
      crews.map((c) => ({
        kind: 'van',
        name: `${c.name} van`,
        crew_id: c.id,
        created_at: now,
        updated_at: now,
      })),
    )
  // Short aliases: the app's Knex settings turn snake_case keys into camelCase on the way out.
  const classes = await knex('lamp_classes').select('label', 'rated_volts as v', 'rated_amps as a', 'shunted')
  const items = new Map<string, string>()
  for (const c of classes) {
    const [v, a, s] = [Number(c.v), Number(c.a), Boolean(c.shunted)]
    const key = lampKey(v, a, s)
    if (!items.has(key)) items.set(key, `${c.label} ${+v} V ${+a} A`)
  }
  const rows = [
    ...[...items].map(([key, name]) => ({ kind: 'lamp', name, lamp_key: key })),
    ...SPARES.map((name) => ({ kind: 'spare', name, lamp_key: null })),
  ]
  await knex('stock_items').insert(rows.map((r) => ({ ...r, created_at: now, updated_at: now })))

  // A low-stock notice kind, added to whatever kinds the table holds by now.
  const [res] = await knex.raw(
    "SELECT column_type AS t FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'notices' AND column_name = 'kind'",
  )
  const kinds = [...String(res[0].t).matchAll(/'([^']+)'/g)].map((m) => m[1])
  if (!kinds.includes('low_stock')) await setKinds(knex, [...kinds, 'low_stock'])
}

async function setKinds(knex: Knex, kinds: string[]) {
  const list = kinds.map((k) => knex.raw('?', [k]).toQuery()).join(', ')
  await knex.raw(`ALTER TABLE notices MODIFY kind ENUM(${list}) NOT NULL`)
}

export async function down(knex: Knex): Promise<void> {
  await knex('notices').where({ kind: 'low_stock' }).delete()
  const [res] = await knex.raw(
    "SELECT column_type AS t FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = 'notices' AND column_name = 'kind'",
  )
  const kinds = [...String(res[0].t).matchAll(/'([^']+)'/g)].map((m) => m[1])
  await setKinds(
    knex,
    kinds.filter((k) => k !== 'low_stock'),
  )
  for (const t of ['stock_movements', 'stock_levels', 'stock_locations', 'stock_items'])
    await knex.schema.dropTable(t)
}
