// The client report's PDF, laid out and drawn by pdfmake with the Roboto fonts shipped inside
// pdfmake. Pure and synchronous-heavy, so it runs on a worker thread (workers/tasks.ts
// `clientReportPdf`); the figures come from services/client-report-pdf.ts on the event loop.
import { createRequire } from 'node:module'
import { dirname, resolve, sep } from 'node:path'
import { formatDay } from '../../shared/local-time'
import { statusLabel, statuses } from '../../shared/vocab/string-states'
import type { ClientReport } from '../../shared/schemas/client-report'

type Node = Record<string, unknown> | string

export interface StringOut {
  assetTag: string
  name: string
  status: 'dark' | 'replace'
  site: string
}

export interface PdfInput {
  report: ClientReport
  out: StringOut[]
  /** When it was made, in words on the client's clock. */
  madeAt: string
  locale: string
}

interface PdfMake {
  addFonts(fonts: unknown): void
  setUrlAccessPolicy(allow: (url: string) => boolean): void
  setLocalAccessPolicy(allow: (path: string) => boolean): void
  createPdf(doc: unknown): { getBuffer(): Promise<Buffer> }
}

const require = createRequire(import.meta.url)
let pdfmake: PdfMake | null = null

/** pdfmake, set up once: its own Roboto fonts, no URL fetches, no files outside its font folder. */
function maker(): PdfMake {
  if (pdfmake) return pdfmake
  const pm = require('pdfmake') as PdfMake
  const fontDir = resolve(dirname(require.resolve('pdfmake/fonts/Roboto.js')), 'Roboto') + sep
  pm.addFonts(require('pdfmake/fonts/Roboto.js'))
  pm.setUrlAccessPolicy(() => false)
  pm.setLocalAccessPolicy((path) => resolve(path).startsWith(fontDir))
  return (pdfmake = pm)
}

const MAX_LISTED = 40

/** The PDF's bytes. */
export async function renderClientReportPdf(input: PdfInput): Promise<Uint8Array> {
  return maker().createPdf(layout(input)).getBuffer()
}

const numbers =
  (locale: string) =>
  (v: number, digits = 0) =>
    v.toLocaleString(locale, { maximumFractionDigits: digits, minimumFractionDigits: 0 })
const pct = (a: number, b: number) => (b ? `${Math.round((a / b) * 100)} %` : '—')

function table(rows: [string, string][]): Node {
  return {
    table: { widths: ['*', 'auto'], body: rows.map(([k, v]) => [k, { text: v, alignment: 'right' }]) },
    layout: 'lightHorizontalLines',
    margin: [0, 0, 0, 12],
  }
}

function layout({ report: r, out, madeAt, locale }: PdfInput) {
  const n = numbers(locale)
  const c = r.client
  const f = r.faults
  const v = r.visits
  const section = (text: string): Node => ({ text, style: 'h2' })
  const register = statuses
    .filter((s) => r.strings.byStatus[s])
    .map((s): [string, string] => [statusLabel[s], n(r.strings.byStatus[s])])
  const listed = out.slice(0, MAX_LISTED)
  const content: Node[] = [
    { text: `Client report: ${c.name}`, style: 'h1' },
    {
      text: `${formatDay(r.from, locale)} to ${formatDay(r.to, locale)} · contract ${c.contractRef ?? 'not recorded'}`,
      margin: [0, 0, 0, 4],
    },
    {
      text: `Response times in the contract: emergencies within ${c.emergencyHours} h, standard faults within ${c.standardHours} h.`,
      style: 'muted',
      margin: [0, 0, 0, 12],
    },
    section('The register today'),
    table([['Strings on the register', n(r.strings.total)], ...register]),
    section('Work done in the period'),
    table([
      ['Visits', n(v.total)],
      ['Failed lamps found', n(v.lampsFound)],
      ['Lamps replaced', n(v.lampsReplaced)],
      ['Fuse lamps replaced', n(v.fuseLampsReplaced)],
      [
        'Relamps made under isolation',
        `${n(v.relampsIsolated)} of ${n(v.relamps)} (${pct(v.relampsIsolated, v.relamps)})`,
      ],
      ['Photos taken', n(v.photos)],
    ]),
    section('Faults against contract times'),
    table([
      ['Faults opened in the period', n(f.opened)],
      ['Closed', n(f.closed)],
      ['Closed within contract time', `${n(f.closedOnTime)} (${pct(f.closedOnTime, f.closed)})`],
      ['Median time to close', f.medianHoursToClose === null ? '—' : `${n(f.medianHoursToClose, 1)} h`],
      ['Open and past their due time now', n(f.openOverdueNow)],
    ]),
    section('Public reports'),
    table([
      ['Reports received in the period', n(r.publicReports.received)],
      ['Fixed so far', n(r.publicReports.fixed)],
    ]),
    section('Energy'),
    table([
      ['Nights in season in the period', n(r.energy.nights)],
      ['Energy used (estimate)', `${n(r.energy.kwh, 1)} kWh`],
      [
        'Cost at the contract tariff (estimate)',
        `£${r.energy.cost.toLocaleString(locale, { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`,
      ],
    ]),
    section('Strings needing work now'),
    out.length
      ? {
          table: {
            headerRows: 1,
            widths: ['auto', '*', '*', 'auto'],
            body: [
              ['Tag', 'String', 'Site', 'State'].map((t) => ({ text: t, bold: true })),
              ...listed.map((s) => [s.assetTag, s.name, s.site, statusLabel[s.status]]),
            ],
          },
          layout: 'lightHorizontalLines',
        }
      : { text: 'None: every string is lit, on watch or made safe.', style: 'muted' },
  ]
  if (out.length > listed.length)
    content.push({ text: `and ${out.length - listed.length} more.`, style: 'muted', margin: [0, 4, 0, 0] })
  return {
    info: { title: `Client report: ${c.name}, ${r.from} to ${r.to}`, creator: 'Lampwright' },
    pageSize: 'A4',
    pageMargins: [40, 48, 40, 48],
    defaultStyle: { font: 'Roboto', fontSize: 10 },
    styles: {
      h1: { fontSize: 18, bold: true, margin: [0, 0, 0, 6] },
      h2: { fontSize: 13, bold: true, margin: [0, 6, 0, 4] },
      muted: { color: '#555555' },
    },
    footer: (page: number, pages: number) => ({
      text: `Made ${madeAt} · page ${page} of ${pages}`,
      alignment: 'center',
      fontSize: 8,
      color: '#555555',
    }),
    content,
  }
}
