import type { CrewRun } from '../../api/runs'

// Each crew's run is told apart by a letter on every stop, a dash pattern on the map and a
// colour, so the map still reads in grey-scale or for colour-blind supervisors. Colours are theme
// tokens (css/app.sass) chosen away from the state colours Replace now and Watch.
const DASHES = ['', '12 8', '2 7', '16 6 3 6', '6 5']
export const COLOURS = [
  'var(--q-primary)',
  'var(--lw-safe)',
  'var(--lw-text)',
  'var(--lw-dark)',
  'var(--lw-muted)',
]

export interface RunStyle {
  letter: string
  dash: string
  colour: string
  /** index into the patterns, for CSS class names */
  slot: number
}

/** Styles by crew id, stable for the order the runs are given in. */
export function runStyles(runs: Pick<CrewRun, 'crewId' | 'crewName'>[]): Map<number, RunStyle> {
  const used = new Set<string>()
  const styles = new Map<number, RunStyle>()
  runs.forEach((run, i) => {
    // The crew's initial when it is free, else the next free letter of the alphabet.
    let letter = run.crewName.trim().charAt(0).toUpperCase()
    for (let code = 65; !letter || used.has(letter); code++) letter = String.fromCharCode(code)
    used.add(letter)
    const slot = i % DASHES.length
    styles.set(run.crewId, { letter, dash: DASHES[slot], colour: COLOURS[slot], slot })
  })
  return styles
}

export function stopLabel(style: RunStyle | undefined, index: number): string {
  return `${style?.letter ?? ''}${index + 1}`
}

export function minutes(n: number): string {
  const h = Math.floor(n / 60)
  const m = Math.round(n % 60)
  if (!h) return `${m} min`
  return m ? `${h} h ${String(m).padStart(2, '0')} min` : `${h} h`
}
