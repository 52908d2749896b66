// One-off: draws the app icons for the web app manifest from public/icons/icon.svg, rendered by the
// local Chromium (no network). Run: node --import tsx scripts/make-pwa-icons.ts
import { readFile } from 'node:fs/promises'
import { chromium } from 'playwright-core'

const FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
]

// Maskable icons are cropped to a circle or squircle by the launcher: keep the mark inside the
// central 80 % "safe zone" (W3C Web App Manifest, "icon masks").
const targets = [
  { file: 'public/icons/icon-192.png', size: 192, inset: 0 },
  { file: 'public/icons/icon-512.png', size: 512, inset: 0 },
  { file: 'public/icons/maskable-512.png', size: 512, inset: 0.14 },
  { file: 'public/icons/apple-touch-icon-180.png', size: 180, inset: 0.08 },
]

const svg = await readFile('public/icons/icon.svg', 'utf8')
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: FLAGS })
try {
  for (const t of targets) {
    const page = await browser.newPage({ viewport: { width: t.size, height: t.size } })
    const pad = Math.round(t.size * t.inset)
    await page.setContent(
      `<html><body style="margin:0;background:#15110D"><div style="width:${t.size}px;height:${t.size}px;` +
        `box-sizing:border-box;padding:${pad}px">${svg.replace('<svg ', '<svg width="100%" height="100%" ')}</div></body></html>`,
    )
    await page.screenshot({ path: t.file, omitBackground: false })
    await page.close()
    console.log('wrote', t.file)
  }
} finally {
  await browser.close()
}
