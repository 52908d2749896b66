// Reads the Solomon instances in tests/fixtures/solomon (format in its SOURCE.md) into the shape the
// solve-vrptw API takes, plus the best-known vehicle count and distance from the header.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'

export interface SolomonInstance {
  name: string
  bestVehicles: number
  bestDistance: number
  depot: { x: number; y: number; ready: number; due: number }
  capacity: number
  stops: { id: string; x: number; y: number; demand: number; ready: number; due: number; service: number }[]
}

export const SOLOMON_DIR = join(import.meta.dirname, '../../tests/fixtures/solomon')
export const SOLOMON_NAMES = ['C101', 'C201', 'R101', 'R201', 'RC101', 'RC201']

export function readSolomon(name: string): SolomonInstance {
  const lines = readFileSync(join(SOLOMON_DIR, `${name}.txt`), 'utf8').split('\n')
  const header = new Map<string, string>()
  const rows: number[][] = []
  for (const line of lines) {
    const parts = line.trim().split(/\s+/)
    if (parts[0] === '') continue
    if (/^[A-Z_]+$/.test(parts[0])) header.set(parts[0], parts.slice(1).join(' '))
    else rows.push(parts.map(Number))
  }
  const [, dx, dy, , dReady, dDue] = rows[0]
  return {
    name,
    bestVehicles: Number(header.get('VEHICLES')),
    bestDistance: Number(header.get('BEST_KNOWN_DISTANCE')),
    capacity: Number(header.get('CAPACITY')),
    depot: { x: dx, y: dy, ready: dReady, due: dDue },
    stops: rows.slice(1).map(([id, x, y, demand, ready, due, service]) => ({
      id: String(id),
      x,
      y,
      demand,
      ready,
      due,
      service,
    })),
  }
}
