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
