// Chunk groups for rolldown (build.rolldownOptions.output.codeSplitting): what every screen draws with
// goes into one "base" chunk instead of ~20 small ones. Left to itself the bundler split Vue and the
// Quasar pieces every page uses (buttons, fields, form, page, layout, header) into files of 0.2–7 kB;
// each costs a request and ~0.35 kB of response headers, about 7 kB on the public report page alone
// (issue 14: ≤ 120 kB of JavaScript on / and /report). All of it is needed by the sign-in page, the
// public report page and the signed-in layout alike, so no page loads code it does not use; what one
// feature needs (tables, dialogs, menus, maps, charts) keeps its own chunk.
import type { Rolldown } from 'vite'

type Group = NonNullable<
  Exclude<NonNullable<Rolldown.OutputOptions['codeSplitting']>, boolean>['groups']
>[number]

/** A path pattern from its parts, either slash matching. */
const path = (...parts: string[]) => parts.join(String.raw`[\\/]`)

// The Quasar components on every screen; the bundler adds the utilities they import (a group takes its
// modules' dependencies too, the option's default).
const EVERY_SCREEN = 'btn|icon|spinner|input|form|banner|page|space|layout|header|toolbar'

const BASE = [
  path('node_modules', '@vue', ''),
  path('node_modules', 'quasar', 'src', 'components', `(${EVERY_SCREEN})`, ''),
  // Small modules every screen imports that otherwise sat in files of their own (< 1 kB each): Quasar's
  // default language pack (its Lang plugin imports it whatever APP_LOCALE is) and type tests, Vue's SFC
  // helper, the API wrapper and the role table.
  path('node_modules', 'quasar', 'lang', String.raw`en-US\.js$`),
  path('node_modules', 'quasar', 'src', 'utils', 'is', ''),
  'plugin-vue:export-helper',
  path('src', 'api', String.raw`http\.ts$`),
  path('shared', String.raw`roles\.ts$`),
]

export const chunkGroups: Group[] = [{ name: 'base', test: new RegExp(BASE.join('|')) }]
