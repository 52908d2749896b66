import { divIcon as leafletDivIcon, type DivIconOptions, type Icon } from 'leaflet/dist/leaflet-src.esm'
import { STATE_WORDS, type StringState } from '../common/string-state'
import { URGENCY_ORDER } from '../../api/map-view'

// The same shapes as components/common/StateMark.vue, as markup Leaflet can place on the map.
// Shape and word carry the state; colour only adds to them.
const SHAPES: Record<StringState, string> = {
  lit: '<circle cx="12" cy="12" r="8.5"/>',
  watch: '<circle cx="12" cy="12" r="7.75" class="o"/><path d="M12 4.25a7.75 7.75 0 0 0 0 15.5z"/>',
  replace: '<path d="M12 2.75 22.25 20.5H1.75z" stroke-linejoin="round"/>',
  dark: '<rect x="4.5" y="4.5" width="15" height="15" rx="1" class="o"/>',
  safe:
    '<path d="M7.75 11V7.75a4.25 4.25 0 0 1 8.5 0V11" class="o"/>' +
    '<rect x="4.5" y="10.5" width="15" height="11" rx="2"/>',
}

export function shapeSvg(state: StringState): string {
  return `<svg viewBox="0 0 24 24" aria-hidden="true" focusable="false">${SHAPES[state]}</svg>`
}

// What a cluster bubble shows: the state that most needs a crew. Made safe sits above Watch
// because the string is off until repaired, but below Replace now and Dark, which nobody has
// dealt with yet. The order is shared with the server, which groups strings the same way.
export const BY_URGENCY = [...URGENCY_ORDER] as StringState[]
export const STATE_URGENCY = Object.fromEntries(BY_URGENCY.map((s, i) => [s, i])) as Record<
  StringState,
  number
>

// vue-leaflet types its icon prop as a plain Icon; a DivIcon is one at run time.
const divIcon = (options: DivIconOptions) => leafletDivIcon(options) as unknown as Icon

// The visible mark is smaller than the icon box: the box is the 48 px touch target.
const TARGET = 48
const pinCache = new Map<string, Icon>()

export function stringIcon(state: StringState, selected: boolean): Icon {
  const key = `${state}:${selected}`
  let icon = pinCache.get(key)
  if (!icon) {
    icon = divIcon({
      className: 'lw-pin-box',
      html: `<span class="lw-pin lw-pin--${state}${selected ? ' lw-pin--selected' : ''}">${shapeSvg(state)}</span>`,
      iconSize: [TARGET, TARGET],
      iconAnchor: [TARGET / 2, TARGET / 2],
    })
    pinCache.set(key, icon)
  }
  return icon
}

export function clusterIcon(count: number, worst: StringState): Icon {
  // A group holding a dark string is drawn a size up: Dark is the state that most needs a crew.
  const size = (count < 10 ? 48 : count < 100 ? 54 : 60) + (worst === 'dark' ? 6 : 0)
  const label = count >= 1000 ? `${Math.round(count / 100) / 10}k` : String(count)
  return divIcon({
    className: 'lw-pin-box',
    html:
      `<span class="lw-cluster lw-cluster--${worst}">${shapeSvg(worst)}<b>${label}</b>` +
      `<span class="lw-sr">${count} strings, most urgent: ${STATE_WORDS[worst]}</span></span>`,
    iconSize: [size, size],
    iconAnchor: [size / 2, size / 2],
  })
}

export function hereIcon(): Icon {
  return divIcon({
    className: 'lw-pin-box',
    html: '<span class="lw-here" title="You are here"></span>',
    iconSize: [28, 28],
    iconAnchor: [14, 14],
  })
}

export function labelIcon(text: string, angleDeg: number): Icon {
  // Street names read left to right: flip anything that would be upside down.
  const a = angleDeg > 90 ? angleDeg - 180 : angleDeg < -90 ? angleDeg + 180 : angleDeg
  const safe = text.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`)
  return divIcon({
    className: 'lw-map-label-box',
    html: `<span class="lw-map-label" style="transform: translate(-50%, -50%) rotate(${a.toFixed(1)}deg)">${safe}</span>`,
    iconSize: [0, 0],
  })
}
