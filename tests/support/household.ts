/** A fresh household of a test's own on the built server, and the small helpers the API tests share. */
import { expect } from 'vitest'
import { ApiClient, type RunningServer } from './server'

export const H = 3_600_000
export const ago = (hours: number) => new Date(Date.now() - hours * H).toISOString()

const isoDate = (d: Date) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`
/** Today's local date shifted by whole months, computed by hand (not with the app's helper). */
export function monthsFromToday(months: number, day = 15): string {
  const now = new Date()
  return isoDate(new Date(now.getFullYear(), now.getMonth() + months, day))
}
export const localToday = () => isoDate(new Date())

/** The session cookie of a sign-in, for requests the ApiClient does not make (uploads, CSV). */
export async function cookieFor(server: RunningServer, email: string, password: string) {
  const res = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

export async function jarStock(client: ApiClient, householdId: string, jarSizeId: string): Promise<number> {
  const res = await client.get(`/api/households/${householdId}/jar-stock`)
  return res.body.find((r: { jarSizeId: string }) => r.jarSizeId === jarSizeId).count
}

export interface TestHousehold {
  owner: ApiClient
  id: string
  email: string
  password: string
  /** A weighted-gauge canner, two layers of pints. */
  cannerId: string
  /** A dial-gauge canner with a gauge test today. */
  dialCannerId: string
  api: (path: string) => string
}

/**
 * Sign up a new person with a household at 2,500 ft, a weighted and a dial canner, and 30 empty
 * pint jars; every step must answer as expected or the test stops here.
 */
export async function newHousehold(server: RunningServer, who: { email: string, password: string, name: string, householdName: string }): Promise<TestHousehold> {
  const owner = new ApiClient(server.url)
  const reg = await owner.post('/api/auth/register', who)
  expect(reg.status).toBe(201)
  const id = reg.body.households[0].id as string
  const api = (path: string) => `/api/households/${id}${path}`
  expect((await owner.patch(api(''), { altitudeFt: 2500 })).status).toBe(200)
  const canner = await owner.post(api('/canners'), { name: 'Big weighted canner', innerDiameterMm: 310, usableHeightMm: 330, rackThicknessMm: 6, gaugeType: 'weighted', maxLayers: 2, waterDepthMm: 76 })
  expect(canner.status).toBe(201)
  const dial = await owner.post(api('/canners'), { name: 'Dial canner', innerDiameterMm: 300, usableHeightMm: 220, rackThicknessMm: 6, gaugeType: 'dial', maxLayers: 1, waterDepthMm: 76, lastGaugeTestAt: localToday() })
  expect(dial.status).toBe(201)
  expect((await owner.request('PUT', api('/jar-stock'), { jarSizeId: 'pint-regular', count: 30 })).status).toBe(200)
  return { owner, id, email: who.email, password: who.password, cannerId: canner.body.id, dialCannerId: dial.body.id, api }
}

/** The newest link to `path` (e.g. "/invite/") in mail to `email`, read from that person's own Outbox. */
export async function linkInMail(client: ApiClient, email: string, path: string): Promise<string> {
  const box = (await client.get('/api/dev/outbox')).body as Array<{ to: string[], text: string }>
  expect(Array.isArray(box), JSON.stringify(box)).toBe(true)
  const mail = box.find(m => m.to.includes(email) && m.text.includes(path))
  expect(mail, `no mail with ${path} to ${email}`).toBeDefined()
  const link = mail!.text.match(new RegExp(`https?://\\S+${path.replace(/\//g, '\\/')}[A-Za-z0-9_-]+`))
  expect(link).not.toBeNull()
  return link![0]
}

/**
 * A person with an account (and a household) of their own, brought into `household` with `role`
 * the way a person is: the owner invites them, they open the link from their mail and accept.
 * Their session then works in `household`.
 */
export async function joinByInvitation(server: RunningServer, household: TestHousehold, who: { email: string, password: string, name: string }, role: 'helper' | 'canner' | 'owner') {
  const person = new ApiClient(server.url)
  const reg = await person.post('/api/auth/register', { ...who, householdName: `${who.name}'s kitchen` })
  expect(reg.status).toBe(201)
  const invited = await household.owner.post(household.api('/invitations'), { email: who.email, role })
  expect(invited.status, JSON.stringify(invited.body)).toBe(201)
  const link = await linkInMail(person, who.email, '/invite/')
  const token = link.split('/invite/')[1]!
  const accepted = await person.post(`/api/invitations/${token}/accept`, { mode: 'signed-in' })
  expect(accepted.status, JSON.stringify(accepted.body)).toBe(200)
  expect(accepted.body.activeHouseholdId).toBe(household.id)
  return { client: person, userId: accepted.body.user.id as string, ownHouseholdId: reg.body.households[0].id as string }
}
