import type { Knex } from 'knex'
import { engineInput, type TypeSpec } from '../shared/string-status'
import { stringCondition } from '../shared/engine/string-condition'

// Engine, second edition (issue 11): string types carry parallel chains, LED driver data and a
// reference measurement of a healthy string; lamp classes their own life model; strings keep lamp age
// as exposure (rated-voltage hours per class) and say which replace-now rule fired.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('string_types', (t) => {
    t.integer('branches').notNullable().defaultTo(1)
    t.decimal('power_factor', 4, 3)
    t.integer('driver_min_volts')
    t.integer('driver_max_volts')
    t.decimal('inrush_peak_amps', 8, 3)
    t.decimal('inrush_ms', 8, 3) // LED driver surges last about 0.1–0.5 ms
    t.decimal('reference_cold_ohms', 10, 2)
    t.decimal('reference_hot_amps', 8, 4)
    t.decimal('reference_volts', 7, 2)
    t.decimal('hot_cold_ratio', 5, 2)
    t.decimal('replace_risk', 4, 3) // null: the default (shared/engine/defaults.ts)
  })
  await knex.schema.alterTable('lamp_classes', (t) => {
    t.integer('rated_life_hours') // null: the type's
    t.decimal('life_exponent', 5, 2) // null: the type's
  })
  await knex.schema.alterTable('strings', (t) => {
    t.json('lamp_exposure') // [rated-voltage hours per lamp class]
    t.dateTime('exposure_at') // when lamp_exposure (and lamp_age_hours) were last brought up to date
    t.enum('replace_rule', ['ratio', 'risk'])
    // When the risk rule fired: the chance and the time it was judged against, in words for the queue.
    t.string('risk_note', 255)
  })
  await convertLampAge(knex, new Date())
}

/**
 * The data step: each string's burning hours become exposure per class, h × r^d at the ratio its lamps
 * run at as recorded now (the best conversion available: the history of earlier ratios is not
 * kept). A string dark or made safe is taken at the ratio its lamps burned at when lit (its fuse lamp
 * intact); a string with no lamp lit counts its hours at rating. LED classes count plain hours.
 * Exported for its test; run once by `up`.
 */
export async function convertLampAge(knex: Knex, now: Date): Promise<number> {
  const types = new Map<number, TypeSpec & { technology: string }>()
  for (const t of await knex('string_types').select('*')) {
    const classes = await knex('lamp_classes').where('string_type_id', t.id).orderBy('position').select('*')
    types.set(t.id, {
      technology: t.technology,
      wiring: t.wiring,
      supplyVolts: Number(t.supply_volts ?? t.supplyVolts),
      lifeExponent: Number(t.life_exponent ?? t.lifeExponent),
      replaceAtRatio: Number(t.replace_at_ratio ?? t.replaceAtRatio),
      classes: classes.map((c) => ({
        count: Number(c.count),
        ratedVolts: Number(c.rated_volts ?? c.ratedVolts),
        ratedAmps: Number(c.rated_amps ?? c.ratedAmps),
        shunted: Boolean(c.shunted),
        lifeExponent:
          (c.life_exponent ?? c.lifeExponent) == null ? null : Number(c.life_exponent ?? c.lifeExponent),
      })),
    })
  }
  const strings = await knex('strings').whereNull('lamp_exposure').select('*')
  for (const s of strings) {
    const type = types.get(s.type_id ?? s.typeId)
    if (!type) continue
    const hours = Number(s.lamp_age_hours ?? s.lampAgeHours ?? 0)
    const lampsOut = Number(s.lamps_out ?? s.lampsOut ?? 0)
    const input = engineInput(type, { lampsOut, fuseFailed: false, dark: false, isolated: false })
    const c = stringCondition(input.supplyVolts, input.lamps, input.wiring)
    const exposure = type.classes.map((k, i) => {
      if (type.technology === 'led' || c.dark) return hours
      const d = k.lifeExponent ?? type.lifeExponent
      return Math.round(hours * c.ratios[i] ** d * 100) / 100
    })
    await knex('strings')
      .where('id', s.id)
      .update({ lamp_exposure: JSON.stringify(exposure), exposure_at: now })
  }
  return strings.length
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('strings', (t) => {
    t.dropColumn('lamp_exposure')
    t.dropColumn('exposure_at')
    t.dropColumn('replace_rule')
    t.dropColumn('risk_note')
  })
  await knex.schema.alterTable('lamp_classes', (t) => {
    t.dropColumn('rated_life_hours')
    t.dropColumn('life_exponent')
  })
  await knex.schema.alterTable('string_types', (t) => {
    for (const c of [
      'branches',
      'power_factor',
      'driver_min_volts',
      'driver_max_volts',
      'inrush_peak_amps',
      'inrush_ms',
      'reference_cold_ohms',
      'reference_hot_amps',
      'reference_volts',
      'hot_cold_ratio',
      'replace_risk',
    ])
      t.dropColumn(c)
  })
}
