import { STATE_WORDS } from '../common/string-state'
import type { RegisterRow } from '../../api/register'
import type { CsvRow } from '../common/csv'
import { formatDate } from '../../dates'

const isoDay = (iso: string | null) => formatDate(iso, 'isoDate') || null

const HEADER = [
  'Tag',
  'Name',
  'State',
  'Lamps out',
  'Type code',
  'Type',
  'Technology',
  'Site',
  'Client',
  'Circuit',
  'Structure',
  'Installed',
  'Last visit',
  'Forecast dark',
  'Latitude',
  'Longitude',
]

/** The register as the user filtered it, one line a string. */
export function registerRows(items: readonly RegisterRow[]): CsvRow[] {
  return [
    HEADER,
    ...items.map((r) => [
      r.assetTag,
      r.name,
      STATE_WORDS[r.status],
      r.lampsOut,
      r.typeCode,
      r.typeName,
      r.technology,
      r.siteName,
      r.clientName,
      r.circuitRef,
      r.structureRef,
      isoDay(r.installedOn),
      formatDate(r.lastVisitAt, 'csv') || null,
      isoDay(r.forecastDarkAt),
      r.lat,
      r.lng,
    ]),
  ]
}
