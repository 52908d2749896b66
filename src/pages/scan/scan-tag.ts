// What a scanned code or a typed entry says: a plain asset tag ("WF-HS-002") or the link our labels
// carry ("<origin>/scan?tag=WF-HS-002", so a phone's own camera app opens the string too).

// Tags are letters, digits and a few separators, 2–40 long (the server's tag rule).
const TAG = /^[A-Z0-9][A-Z0-9._/-]{1,39}$/

/** The asset tag in a scan or typed text, upper-cased as the register keeps it; null if there is none. */
export function tagFromScan(text: string): string | null {
  const raw = text.trim()
  if (/^https?:\/\//i.test(raw)) {
    let url: URL
    try {
      url = new URL(raw)
    } catch {
      return null
    }
    const tag = url.searchParams.get('tag')
    return tag ? normalise(tag) : null
  }
  return normalise(raw)
}

function normalise(tag: string): string | null {
  const t = tag.trim().toUpperCase()
  return TAG.test(t) ? t : null
}
