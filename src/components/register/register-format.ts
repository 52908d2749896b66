import dayjs from 'dayjs'
import { STATE_WORDS } from '../common/string-state'
import type { RegisterRow } from '../../api/register'
import type { CsvRow } from '../common/csv'

/** A calendar day, or a dash when the register has none. */
export function day(iso: string | null): string {
  return iso ? dayjs(iso).format('D MMM YYYY') : '—'
}

const isoDay = (iso: string | null) => (iso ? dayjs(iso).format('YYYY-MM-DD') : null)

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
      r.lastVisitAt ? dayjs(r.lastVisitAt).format('YYYY-MM-DD HH:mm') : null,
      isoDay(r.forecastDarkAt),
      r.lat,
      r.lng,
    ]),
  ]
}
