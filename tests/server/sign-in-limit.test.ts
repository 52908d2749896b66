// Sign-in throttling counted in MariaDB. Each test uses its own e-mail; tests that must fail from the
// loopback address clear that address's counter afterwards, the others come from their own
// documentation address (RFC 5737 TEST-NET-3) through an app that trusts the loopback proxy.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { clearLoopbackSignInCount, createAccount, signIn } from './account-helpers'

let t: TestApp
let proxied: TestApp
beforeAll(async () => {
  t = await makeTestApp()
  proxied = await makeTestApp({ TRUST_PROXY: 'loopback' })
})
afterAll(async () => {
  await clearLoopbackSignInCount(t)
  await proxied.close()
  await t.close()
})

let nextHost = 1
/** A client address of its own for one test, e.g. 203.0.113.7. */
const newAddress = () => `203.0.113.${nextHost++}`

// Real accounts (cheap password hashes) rather than unknown e-mails, whose check is full-cost on purpose.
const someAccounts = (n: number) => Promise.all(Array.from({ length: n }, () => createAccount(t, 'crew')))

function expectLimited(res: request.Response) {
  expect(res.status).toBe(429)
  expect(res.body.error.code).toBe('rate_limited')
  // RFC 9110 §10.2.3: Retry-After as a number of seconds; the window is 15 minutes.
  const seconds = Number(res.headers['retry-after'])
  expect(seconds).toBeGreaterThan(0)
  expect(seconds).toBeLessThanOrEqual(15 * 60)
}

describe('sign-in throttling per account', () => {
  afterEach(() => clearLoopbackSignInCount(t))

  it('counts padded and upper-cased spellings of one e-mail together, whatever X-Forwarded-For says', async () => {
    const a = await createAccount(t, 'crew')
    const spellings = [a.email, ` ${a.email}`, a.email.toUpperCase(), `  ${a.email.toUpperCase()}  `]
    for (let i = 0; i < 10; i++) {
      const res = await signIn(t, spellings[i % 4]!, `guess-${i}`, { 'X-Forwarded-For': `198.51.100.${i}` })
      expect(res.status).toBe(401)
    }
    expectLimited(
      await signIn(t, `\t${a.email.toUpperCase()} `, 'guess-10', { 'X-Forwarded-For': '10.9.9.9' }),
    )
    // The right password waits too: the limit is on the account, not on wrong guesses only.
    expectLimited(await signIn(t, a.email, a.password))
  })

  it('a successful sign-in clears the failures counted so far', async () => {
    const a = await createAccount(t, 'crew')
    const from = { 'X-Forwarded-For': newAddress() }
    for (let i = 0; i < 9; i++) await signIn(proxied, a.email, `guess-${i}`, from)
    expect((await signIn(proxied, a.email, a.password, from)).status).toBe(200)
    for (let i = 0; i < 10; i++) expect((await signIn(proxied, a.email, `again-${i}`, from)).status).toBe(401)
    expectLimited(await signIn(proxied, a.email, a.password, from))
  })

  it('holds across two app processes on the same database', async () => {
    const second = await makeTestApp({ TRUST_PROXY: 'loopback' })
    try {
      const { email } = await createAccount(t, 'crew')
      const from = { 'X-Forwarded-For': newAddress() }
      for (let i = 0; i < 5; i++) expect((await signIn(proxied, email, `guess-${i}`, from)).status).toBe(401)
      for (let i = 5; i < 10; i++) expect((await signIn(second, email, `guess-${i}`, from)).status).toBe(401)
      expectLimited(await signIn(second, email, 'guess-10', from))
      expectLimited(await signIn(proxied, email, 'guess-11', from))
    } finally {
      await second.close()
    }
  })
})

describe('sign-in throttling per address', () => {
  afterEach(() => clearLoopbackSignInCount(t))

  it('stops one address trying many accounts; a spoofed X-Forwarded-For does not change the address', async () => {
    await clearLoopbackSignInCount(t)
    const targets = await someAccounts(31)
    for (let i = 0; i < 30; i++) {
      const res = await signIn(t, targets[i]!.email, 'password1', { 'X-Forwarded-For': `198.51.100.${i}` })
      expect(res.status).toBe(401)
    }
    expectLimited(await signIn(t, targets[30]!.email, 'password1', { 'X-Forwarded-For': '192.0.2.77' }))
  })

  it('behind a trusted proxy, counts the address the proxy reports', async () => {
    const blocked = newAddress()
    const targets = await someAccounts(32)
    for (let i = 0; i < 30; i++)
      expect(
        (await signIn(proxied, targets[i]!.email, 'password1', { 'X-Forwarded-For': blocked })).status,
      ).toBe(401)
    expectLimited(await signIn(proxied, targets[30]!.email, 'password1', { 'X-Forwarded-For': blocked }))
    const res = await signIn(proxied, targets[31]!.email, 'password1', { 'X-Forwarded-For': newAddress() })
    expect(res.status).toBe(401)
  })
})
