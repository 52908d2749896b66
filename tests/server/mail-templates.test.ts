// The e-mail views (server/mail/views, eta): both parts, values escaped in HTML, dates in the zone
// the mail is about, and the run's date in a run mail's subject and body.
import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../server/config'
import { inviteMail, mailClock, passwordResetMail } from '../../server/mail/templates'
import { runMail } from '../../server/mail/run-mail'
import type { CrewRun } from '../../shared/schemas/runs'

const config = loadConfig({
  APP_TIME_ZONE: 'Europe/London',
  APP_LOCALE: 'en-GB',
  PUBLIC_URL: 'https://lamps.example',
})

const stop = {
  itemId: 1,
  kind: null,
  summary: 'Relamp <b>3</b> dark lamps',
  stringId: 7,
  assetTag: 'LW-0007',
  siteName: 'Market Square',
  lat: 51.5,
  lng: -0.1,
  arrive: '17:10',
  start: '17:10',
  depart: '17:40',
  travelMinutes: 10,
  serviceMinutes: 30,
  pinned: false,
  window: null,
  doneAt: null,
}
const run: CrewRun = {
  id: 1,
  crewId: 1,
  crewName: 'Lantern',
  date: '2026-12-02',
  state: 'published',
  version: 1,
  publishedAt: null,
  depot: { name: 'North depot', lat: 51.5, lng: -0.1 },
  shiftStart: '16:30',
  shiftEnd: '01:00',
  platform: 'MEWP 2',
  stops: [stop],
  returnAt: '18:05',
  totalTravelMinutes: 20,
  totalServiceMinutes: 30,
}

describe('mail templates', () => {
  it('a run mail names the run date in the subject and both parts, and escapes the HTML', () => {
    const m = runMail(config, { name: 'Ann <crew>', email: 'ann@example.org' }, run, true)
    // 2026-12-02 is a Wednesday (calendar); CLDR en-GB's yMMMEd pattern is "EEE, d MMM y" (memory).
    expect(m.subject).toBe('Changed: Lantern run for Wed, 2 Dec 2026 (1 stops)')
    expect(m.text).toContain('Your run for Wed, 2 Dec 2026 has changed since it was published.')
    expect(m.text).toContain(
      'Wed, 2 Dec 2026: shift 16:30–01:00 (ends after midnight) from North depot, platform MEWP 2.',
    )
    expect(m.text).toContain(
      '1. 17:10–17:40  LW-0007 Relamp <b>3</b> dark lamps (Market Square)  geo:51.5,-0.1',
    )
    expect(m.text).toContain('Open it in Lampwright: https://lamps.example/run?date=2026-12-02')
    expect(m.html).toContain('<b>Wed, 2 Dec 2026</b>')
    expect(m.html).toContain('Hello Ann &lt;crew&gt;,')
    expect(m.html).toContain('Relamp &lt;b&gt;3&lt;/b&gt; dark lamps')
    expect(m.html).not.toContain('<b>3</b>')
    expect(m.html?.startsWith('<!doctype html>')).toBe(true)
    expect(m.topic).toBe('run_changed')
  })

  it('writes the link expiry in the zone it is given', () => {
    const at = new Date('2026-12-02T17:45:00Z')
    // December: London is on GMT (UTC+0) → 17:45; New York on EST (UTC−5) → 12:45 (IANA tz rules, memory).
    expect(mailClock(config).dateTime(at)).toBe('Wed 2 Dec, 17:45 (Europe/London time)')
    expect(mailClock(config, 'America/New_York').dateTime(at)).toBe(
      'Wed 2 Dec, 12:45 (America/New_York time)',
    )
    const reset = passwordResetMail(config, { name: 'Bo', email: 'bo@example.org' }, 'tok_en-123', at)
    expect(reset.subject).toBe('Reset your Lampwright password')
    expect(reset.text).toContain('https://lamps.example/reset-password?token=tok_en-123')
    expect(reset.text).toContain('until Wed 2 Dec, 17:45 (Europe/London time)')
    expect(reset.html).toContain('href="https://lamps.example/reset-password?token=tok_en-123"')
    const invite = inviteMail(
      config,
      { name: 'Cy', email: 'cy@example.org', role: 'safety' },
      'abc',
      'Dee',
      at,
    )
    expect(invite.text).toContain('Dee has invited you to Lampwright as Safety officer.')
    expect(invite.text).toContain('the link works until Wed 2 Dec, 17:45 (Europe/London time)')
  })
})

describe('links in e-mails', () => {
  // README: PUBLIC_URL is the base of links in e-mails; a trailing slash or a blank value must not
  // change that (RFC 3986 §3.3: "//accept-invite" would be an empty path segment).
  it('start from PUBLIC_URL when it is set, whatever its trailing slash', () => {
    const slash = loadConfig({ PUBLIC_URL: 'https://lamps.example/' })
    const mail = inviteMail(slash, { name: 'Ada', email: 'ada@example.org', role: 'crew' }, 'tok-1', 'Admin')
    expect(mail.text).toContain('https://lamps.example/accept-invite?token=tok-1')
    expect(mail.html).toContain('https://lamps.example/accept-invite?token=tok-1')
    const reset = passwordResetMail(slash, { name: 'Ada', email: 'ada@example.org' }, 'tok-2', new Date())
    expect(reset.text).toContain('https://lamps.example/reset-password?token=tok-2')
  })

  it("use this server's own address only when PUBLIC_URL is not set", () => {
    const own = loadConfig({ PORT: '4123', PUBLIC_URL: '' })
    const mail = inviteMail(own, { name: 'Ada', email: 'ada@example.org', role: 'crew' }, 'tok-3', 'Admin')
    expect(mail.text).toContain('http://localhost:4123/accept-invite?token=tok-3')
  })
})
