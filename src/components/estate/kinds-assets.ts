// What hangs and who hangs it: string types, strings, crews and platforms.
import { estateEditors, planners } from '../../../shared/roles'
import type { KindView } from './kinds'
import { date, num, opts, pick, ref, text, time } from './field-builders'
import type { FieldDef } from './kinds'

const REFERENCE = 'Reference measurement of a healthy string'
const LED_DRIVER = 'LED driver (from its data sheet)'
const inGroup = (group: string, f: FieldDef, when?: FieldDef['when']): FieldDef => ({ ...f, group, when })
const led = { key: 'technology', is: 'led' }

export const assetViews: KindView[] = [
  {
    kind: 'string-types',
    title: 'String types',
    singular: 'string type',
    write: estateEditors,
    columns: [
      { key: 'code', label: 'Code' },
      { key: 'name', label: 'Name' },
      { key: 'technology', label: 'Lamps' },
      { key: 'supplyVolts', label: 'Supply (V)' },
    ],
    fields: [
      text('code', 'Code', true),
      text('name', 'Name', true),
      pick('technology', 'Lamps', [
        { value: 'filament', label: 'Filament' },
        { value: 'led', label: 'LED' },
      ]),
      pick('wiring', 'Wiring', opts('series', 'parallel')),
      num('supplyVolts', 'Supply (V)', true),
      num('ratedLifeHours', 'Rated life (hours)', true),
      num('lifeExponent', 'Life exponent', true),
      num('weibullShape', 'Weibull shape', true),
      num('replaceAtRatio', 'Replace at ratio', true, 'e.g. 1.05: replace at 5% over rated volts'),
      num(
        'replaceRisk',
        'Replace-now risk',
        false,
        'Replace now when the chance of going dark before the next patrol is above this, e.g. 0.2 = 20 %. Blank: 20 %.',
      ),
      num('shuntFailProbability', 'Shunt failure probability', true),
      num(
        'branches',
        'Parallel chains',
        true,
        'Chains side by side, each holding every lamp class below once',
      ),
      num('lengthM', 'Length (m)'),
      text('notes', 'Notes'),
      inGroup(
        REFERENCE,
        num(
          'referenceColdOhms',
          'Cold resistance (Ω)',
          false,
          'Whole string, isolated, read after it has been lit once',
        ),
      ),
      inGroup(REFERENCE, num('referenceHotAmps', 'Running current (A)')),
      inGroup(
        REFERENCE,
        num('referenceVolts', 'at supply (V)', false, 'The volts the running current was read at'),
      ),
      inGroup(
        REFERENCE,
        num(
          'hotColdRatio',
          'Hot/cold resistance ratio',
          false,
          'Blank: 11, the bench figure for small series lamps',
        ),
      ),
      inGroup(LED_DRIVER, num('powerFactor', 'Power factor', false, 'e.g. 0.9'), led),
      inGroup(LED_DRIVER, num('driverMinVolts', 'Input from (V)'), led),
      inGroup(LED_DRIVER, num('driverMaxVolts', 'Input to (V)'), led),
      inGroup(LED_DRIVER, num('inrushPeakAmps', 'Switch-on peak (A)'), led),
      inGroup(LED_DRIVER, num('inrushMs', 'Switch-on surge lasts (ms)'), led),
    ],
    lampClasses: true,
    defaults: {
      technology: 'filament',
      supplyVolts: 230,
      ratedLifeHours: 3000,
      lampClasses: [{ label: 'lamp', count: 20, ratedVolts: 11.5, ratedAmps: 0.1, shunted: true }],
    },
  },
  {
    kind: 'strings',
    title: 'Strings',
    singular: 'string',
    write: estateEditors,
    columns: [
      { key: 'assetTag', label: 'Tag' },
      { key: 'name', label: 'Name' },
      { key: 'status', label: 'State' },
    ],
    fields: [
      text('assetTag', 'Asset tag', true),
      text('name', 'Name', true),
      ref('typeId', 'Type', 'string-types', 'code'),
      ref('siteId', 'Site', 'sites', 'name'),
      ref('circuitId', 'Circuit', 'circuits', 'ref', false),
      ref('structureId', 'Structure', 'structures', 'ref', false),
      pick('geometry', 'Shape', [
        { value: 'point', label: 'A point (motif, tree)' },
        { value: 'line', label: 'A line (festoon, catenary)' },
      ]),
      num('mountingHeightM', 'Mounting height (m)'),
      date('installedOn', 'Installed on'),
    ],
    point: { lat: 'lat', lng: 'lng' },
    line: true,
    defaults: {},
  },
  {
    kind: 'crews',
    title: 'Crews',
    singular: 'crew',
    write: planners,
    columns: [
      { key: 'name', label: 'Name' },
      { key: 'depotName', label: 'Depot' },
      { key: 'shiftStart', label: 'Shift from' },
      { key: 'shiftEnd', label: 'Shift to' },
    ],
    fields: [
      text('name', 'Name', true),
      text('depotName', 'Depot', true),
      time('shiftStart', 'Shift starts', true),
      time('shiftEnd', 'Shift ends (may be after midnight)', true),
      ref('platformId', 'Platform', 'platforms', 'name', false),
    ],
    point: { lat: 'depotLat', lng: 'depotLng' },
    members: true,
    defaults: { shiftStart: '16:00', shiftEnd: '00:30' },
  },
  {
    kind: 'platforms',
    title: 'Platforms',
    singular: 'platform',
    write: planners,
    columns: [
      { key: 'assetTag', label: 'Tag' },
      { key: 'name', label: 'Name' },
      { key: 'kind', label: 'Kind' },
      { key: 'workingHeightM', label: 'Working height (m)' },
    ],
    fields: [
      text('name', 'Name', true),
      text('assetTag', 'Asset tag', true),
      pick('kind', 'Kind', opts('scissor', 'boom', 'vehicle_mounted', 'tower')),
      num('workingHeightM', 'Working height (m)', true),
      num('safeWorkingLoadKg', 'Safe working load (kg)', true),
      num('maxWindMs', 'Maximum wind (m/s)', true),
    ],
    defaults: { kind: 'scissor' },
  },
]
