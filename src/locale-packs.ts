// The languages the client can show dates and Quasar's own words (date picker, table footers) in, as
// APP_LOCALE names them. A tag is matched whole, then by its language (fr-BE → fr); others keep en-GB.
import dayjs from 'dayjs'
import { Lang } from 'quasar'
// The default packs are in the main bundle already (src/main.ts installs Quasar's before GET /config
// answers): the first screen then waits for no further download after the config (issue 14).
import quasarEnGB from 'quasar/lang/en-GB.js'
import dayjsEnGB from 'dayjs/locale/en-gb.js'

type Pack = { default: unknown }
const packs: Record<string, { dates: () => Promise<Pack>; quasar: () => Promise<Pack> }> = {
  'en-GB': { dates: async () => ({ default: dayjsEnGB }), quasar: async () => ({ default: quasarEnGB }) },
  'en-IE': { dates: () => import('dayjs/locale/en-ie.js'), quasar: async () => ({ default: quasarEnGB }) },
  'en-US': { dates: () => import('dayjs/locale/en.js'), quasar: () => import('quasar/lang/en-US.js') },
  da: { dates: () => import('dayjs/locale/da.js'), quasar: () => import('quasar/lang/da.js') },
  de: { dates: () => import('dayjs/locale/de.js'), quasar: () => import('quasar/lang/de-DE.js') },
  es: { dates: () => import('dayjs/locale/es.js'), quasar: () => import('quasar/lang/es.js') },
  fr: { dates: () => import('dayjs/locale/fr.js'), quasar: () => import('quasar/lang/fr.js') },
  it: { dates: () => import('dayjs/locale/it.js'), quasar: () => import('quasar/lang/it.js') },
  nb: { dates: () => import('dayjs/locale/nb.js'), quasar: () => import('quasar/lang/nb-NO.js') },
  nl: { dates: () => import('dayjs/locale/nl.js'), quasar: () => import('quasar/lang/nl.js') },
  pl: { dates: () => import('dayjs/locale/pl.js'), quasar: () => import('quasar/lang/pl.js') },
  sv: { dates: () => import('dayjs/locale/sv.js'), quasar: () => import('quasar/lang/sv.js') },
}

/** The pack for a locale tag, or null when only en-GB's words are available. */
export function packFor(tag: string): string | null {
  if (packs[tag]) return tag
  const language = tag.split('-')[0].toLowerCase()
  return packs[language] ? language : null
}

/** Loads the month and weekday names and Quasar's words for `tag`; unknown tags keep en-GB. */
export async function applyLocale(tag: string): Promise<void> {
  const pack = packs[packFor(tag) ?? 'en-GB']
  const [dates, quasar] = await Promise.all([pack.dates(), pack.quasar()])
  dayjs.locale(dates.default as ILocale)
  Lang.set(quasar.default as Parameters<typeof Lang.set>[0])
}
