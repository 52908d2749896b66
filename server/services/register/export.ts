// The register as a file (with the page's filters and sort) and the empty template, in the columns
// the import reads back: an export imports again with nothing created and nothing updated.
import type { Response } from 'express'
import type { Db } from '../../db'
import type { RegisterFilters, RegisterSort } from '../../../shared/schemas/register'
import { pageIds, withPlaces } from '../register'
import { siteKey } from './lookups'
import { writeFile, type FileRow } from './write-file'
import type { FileFormat } from './parse-file'

const CHUNK = 2000

type Line = [number, number][] | null
type Row = {
  assetTag: string
  name: string
  typeCode: string
  siteName: string
  clientName: string
  circuitRef: string | null
  structureRef: string | null
  geometry: string
  lat: number
  lng: number
  line: Line | string
  mountingHeightM: number | null
  installedOn: string | null
}

const lineText = (line: Line) => (line ? line.map(([x, y]) => `${x} ${y}`).join(';') : null)

async function* exportChunks(
  db: Db,
  f: RegisterFilters & { sort: RegisterSort; dir: 'asc' | 'desc' },
): AsyncGenerator<FileRow[]> {
  for (let offset = 0; ; offset += CHUNK) {
    const { ids } = await pageIds(db, f, CHUNK, offset)
    const rows = await withPlaces<Row & { id: number }>(db, ids, [
      's.assetTag',
      's.name',
      't.code as typeCode',
      'si.name as siteName',
      'c.name as clientName',
      'ci.ref as circuitRef',
      'st.ref as structureRef',
      's.geometry',
      's.lat',
      's.lng',
      's.line',
      's.mountingHeightM',
      's.installedOn',
    ])
    yield rows.map((r) => ({
      assetTag: r.assetTag,
      name: r.name,
      typeCode: r.typeCode,
      siteName: siteKey(r.clientName, r.siteName),
      circuitRef: r.circuitRef ?? null,
      structureRef: r.structureRef ?? null,
      geometry: r.geometry,
      lat: Number(r.lat),
      lng: Number(r.lng),
      line: lineText(typeof r.line === 'string' ? JSON.parse(r.line) : r.line),
      mountingHeightM: r.mountingHeightM == null ? null : Number(r.mountingHeightM),
      installedOn: r.installedOn ?? null,
    }))
    if (ids.length < CHUNK) return
  }
}

export function exportRegister(
  db: Db,
  res: Response,
  f: RegisterFilters & { format: FileFormat; sort: RegisterSort; dir: 'asc' | 'desc' },
): Promise<void> {
  return writeFile(res, f.format, 'lampwright-register', exportChunks(db, f))
}

/** The columns and one example row, naming a real type and site where the register has them. */
export async function writeTemplate(db: Db, res: Response, format: FileFormat): Promise<void> {
  const type = await db('stringTypes').whereNull('archivedAt').orderBy('code').first('code')
  const site = await db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .whereNull('si.archivedAt')
    .orderBy(['c.name', 'si.name'])
    .first('si.name', 'c.name as clientName')
  const example: FileRow = {
    assetTag: 'EX-0001',
    name: 'High Street catenary 1',
    typeCode: type?.code ?? 'TYPE-CODE',
    siteName: site ? siteKey(site.clientName, site.name) : 'Client name/Site name',
    circuitRef: null,
    structureRef: null,
    geometry: 'line',
    lat: 54.0712,
    lng: -2.2741,
    line: '-2.2745 54.0711;-2.2737 54.0713',
    mountingHeightM: 5.5,
    installedOn: '2026-11-01',
  }
  async function* one() {
    yield [example]
  }
  return writeFile(res, format, 'lampwright-register-template', one())
}
