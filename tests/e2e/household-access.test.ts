/**
 * Bringing people into a household and keeping accounts safe, against the built server:
 * invitations (new and existing people; expired, used and withdrawn links), the last owner,
 * several households per person, password reset, common passwords, rate limits, sign-out
 * that really ends a session, cross-origin writes and markup in stored names.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, expectField, startServer, type RunningServer } from '../support/server'
import { joinByInvitation, linkInMail, newHousehold, type TestHousehold } from '../support/household'

const H = 3_600_000
let server: RunningServer
let home: TestHousehold
let postmaster: ApiClient

const tokenOf = (link: string, path: string) => link.split(path)[1]!

beforeAll(async () => {
  server = await startServer({ env: { SHELFSTEAD_TEST_CLOCK: '1', SHELFSTEAD_TRUST_PROXY: '1', SHELFSTEAD_ADMIN_EMAIL: 'postmaster@example.org' } })
  postmaster = new ApiClient(server.url)
  expect((await postmaster.post('/api/auth/register', { email: 'postmaster@example.org', password: 'reads-all-mail-2026', name: 'Site admin', householdName: 'Admin' })).status).toBe(201)
  home = await newHousehold(server, { email: 'wren@example.org', password: 'pinto-pantry-2026', name: 'Wren Halloway', householdName: 'Halloway larder' })
})
afterAll(async () => { await server?.stop() })

describe('invitations', () => {
  it('a new person accepts from the link in their mail, with an account made for the invited address', async () => {
    const invited = await home.owner.post(home.api('/invitations'), { email: 'Juniper@Example.org', role: 'helper' })
    expect(invited.status).toBe(201)
    expect(invited.body).toEqual([expect.objectContaining({ email: 'juniper@example.org', role: 'helper', status: 'open' })])
    // 7 days (the invitation's stated life), to the minute
    expect(Date.parse(invited.body[0].expiresAt) - Date.now()).toBeGreaterThan(7 * 24 * H - 120_000)
    expect(Date.parse(invited.body[0].expiresAt) - Date.now()).toBeLessThan(7 * 24 * H + 120_000)

    // The Outbox shows a person only mail addressed to them: not the owner, not someone new.
    const ownerBox = (await home.owner.get('/api/dev/outbox')).body as Array<{ to: string[] }>
    expect(ownerBox.some(m => m.to.includes('juniper@example.org'))).toBe(false)
    const peek = new ApiClient(server.url)
    await peek.post('/api/auth/register', { email: 'juniper-peek@example.org', password: 'peek-at-mail-2026', name: 'Peek', householdName: 'Peek' })
    expect(((await peek.get('/api/dev/outbox')).body as Array<{ to: string[] }>)).toEqual([])
    const juniper = new ApiClient(server.url)
    const token = await invitationToken('juniper@example.org')
    const info = await juniper.get(`/api/invitations/${token}`)
    expect(info.body).toMatchObject({ household: 'Halloway larder', role: 'helper', status: 'open', hasAccount: false, invitedBy: 'Wren Halloway' })
    const weak = await juniper.post(`/api/invitations/${token}/accept`, { mode: 'register', name: 'Juniper Moss', password: 'password123' })
    expect(weak.status).toBe(400)
    expectField(weak, 'password', /common passwords/)
    const accepted = await juniper.post(`/api/invitations/${token}/accept`, { mode: 'register', name: 'Juniper Moss', password: 'split-pea-soup-2026' })
    expect(accepted.status).toBe(200)
    expect(accepted.body.activeHouseholdId).toBe(home.id)
    expect(accepted.body.households).toEqual([expect.objectContaining({ id: home.id, role: 'helper' })])
    expect((await juniper.get(home.api('/shelf'))).status).toBe(200)
    // single use
    const again = await new ApiClient(server.url).post(`/api/invitations/${token}/accept`, { mode: 'register', name: 'Someone', password: 'another-long-one-2026' })
    expect(again.status).toBe(409)
    expect(again.body.message).toMatch(/already been used/)
    expect((await juniper.get(`/api/invitations/${token}`)).body.status).toBe('accepted')
  })

  it('an existing person accepts by signing in, and then belongs to two households, seeing only the active one', async () => {
    const other = await newHousehold(server, { email: 'osric@example.org', password: 'lentil-loft-2026', name: 'Osric Pell', householdName: 'Pell cellar' })
    const invited = await home.owner.post(home.api('/invitations'), { email: 'osric@example.org', role: 'canner' })
    expect(invited.status).toBe(201)
    const token = tokenOf(await linkInMail(other.owner, 'osric@example.org', '/invite/'), '/invite/')
    const fresh = new ApiClient(server.url)
    expect((await fresh.get(`/api/invitations/${token}`)).body).toMatchObject({ hasAccount: true, status: 'open' })
    const wrong = await fresh.post(`/api/invitations/${token}/accept`, { mode: 'sign-in', password: 'not-his-password' })
    expect(wrong.status).toBe(401)
    const accepted = await fresh.post(`/api/invitations/${token}/accept`, { mode: 'sign-in', password: 'lentil-loft-2026' })
    expect(accepted.status).toBe(200)
    expect(accepted.body.households.map((h: { id: string }) => h.id).sort()).toEqual([home.id, other.id].sort())
    expect(accepted.body.activeHouseholdId).toBe(home.id)

    // Working in the Halloway larder: the Pell cellar's data is not served on this session.
    const pellShelf = await fresh.get(other.api('/shelf'))
    expect(pellShelf.status).toBe(409)
    expect(pellShelf.body.message).toMatch(/Switch to this one/)
    expect((await fresh.get(home.api('/canners'))).body.map((c: { name: string }) => c.name)).toContain('Big weighted canner')
    const switched = await fresh.post('/api/auth/household', { householdId: other.id })
    expect(switched.status).toBe(200)
    expect((await fresh.get(home.api('/canners'))).status).toBe(409)
    expect((await fresh.get(other.api('/canners'))).status).toBe(200)
    // and Osric's other, older session still works in its own household
    expect((await other.owner.get(other.api('/canners'))).status).toBe(200)
  })

  it('an expired, a withdrawn and a resent (replaced) link each say what to do', async () => {
    const person = new ApiClient(server.url)
    await person.post('/api/auth/register', { email: 'tamar@example.org', password: 'black-bean-barn-2026', name: 'Tamar Ives', householdName: 'Ives barn' })

    await home.owner.post(home.api('/invitations'), { email: 'tamar@example.org', role: 'helper' })
    const first = tokenOf(await linkInMail(person, 'tamar@example.org', '/invite/'), '/invite/')
    const list = (await home.owner.get(home.api('/invitations'))).body as Array<{ id: string, email: string }>
    const invitationId = list.find(i => i.email === 'tamar@example.org')!.id
    expect((await home.owner.post(home.api('/invitations'), { email: 'tamar@example.org', role: 'helper' })).status).toBe(409)

    expect((await home.owner.post(home.api(`/invitations/${invitationId}/resend`))).status).toBe(200)
    const second = tokenOf(await linkInMail(person, 'tamar@example.org', '/invite/'), '/invite/')
    expect(second).not.toBe(first)
    expect((await person.get(`/api/invitations/${first}`)).status).toBe(404)

    // 8 days on, the link has expired
    expect((await person.post('/api/dev/clock', { offsetMs: 8 * 24 * H })).status).toBe(200)
    const expired = await person.get(`/api/invitations/${second}`)
    expect(expired.body).toMatchObject({ status: 'expired' })
    expect(expired.body.message).toMatch(/expired.*send it again/)
    expect((await person.post(`/api/invitations/${second}/accept`, { mode: 'signed-in' })).status).toBe(409)
    expect((await person.post('/api/dev/clock', { offsetMs: 0 })).status).toBe(200)

    expect((await home.owner.delete(home.api(`/invitations/${invitationId}`))).status).toBe(200)
    const withdrawn = await person.get(`/api/invitations/${second}`)
    expect(withdrawn.body).toMatchObject({ status: 'revoked' })
    expect(withdrawn.body.message).toMatch(/withdrawn/)
    const refused = await person.post(`/api/invitations/${second}/accept`, { mode: 'signed-in' })
    expect(refused.status).toBe(409)
    expect((await person.get('/api/auth/me')).body.households).toHaveLength(1)
  })

  it('an invitation for one address cannot be taken by someone signed in as another', async () => {
    const bystander = new ApiClient(server.url)
    await bystander.post('/api/auth/register', { email: 'bystander@example.org', password: 'chickpea-chest-2026', name: 'By Stander', householdName: 'Stander' })
    await home.owner.post(home.api('/invitations'), { email: 'quince@example.org', role: 'owner' })
    const token = await invitationToken('quince@example.org')
    const res = await bystander.post(`/api/invitations/${token}/accept`, { mode: 'signed-in' })
    expect(res.status).toBe(409)
    expect(res.body.message).toMatch(/for quince@example.org.*signed in as bystander@example.org/)
  })

  it('keeps the last owner: not demoted, cannot leave; a second owner makes both possible', async () => {
    const me = (await home.owner.get('/api/auth/me')).body.user.id
    const demote = await home.owner.patch(home.api(`/members/${me}`), { role: 'canner' })
    expect(demote.status).toBe(409)
    expect(demote.body.message).toMatch(/at least one owner/)
    const leave = await home.owner.delete(home.api(`/members/${me}`))
    expect(leave.status).toBe(409)
    expect(leave.body.message).toMatch(/last owner/)

    const second = await joinByInvitation(server, home, { email: 'ivo@example.org', password: 'navy-nook-2026', name: 'Ivo Brant' }, 'helper')
    expect((await second.client.patch(home.api(`/members/${me}`), { role: 'helper' })).status).toBe(403)
    expect((await home.owner.patch(home.api(`/members/${second.userId}`), { role: 'owner' })).status).toBe(200)
    expect((await home.owner.patch(home.api(`/members/${me}`), { role: 'canner' })).status).toBe(200)
    expect((await second.client.patch(home.api(`/members/${me}`), { role: 'owner' })).status).toBe(200)
    // the removed member's session no longer reaches the household
    expect((await home.owner.delete(home.api(`/members/${second.userId}`))).status).toBe(200)
    expect((await second.client.get(home.api('/shelf'))).status).toBe(404)
    expect((await second.client.get('/api/auth/me')).body.activeHouseholdId).toBe(second.ownHouseholdId)
  })

  it('the owner sees who did what, newest first, with names shown as text', async () => {
    const page = (await home.owner.get(home.api('/activity'))).body
    const summaries = page.items.map((a: { summary: string }) => a.summary)
    expect(summaries).toEqual(expect.arrayContaining(['Joined as helper', 'Invited juniper@example.org as helper', 'Made Ivo Brant an owner']))
    const times = page.items.map((a: { at: string }) => Date.parse(a.at))
    expect([...times].sort((a, b) => b - a)).toEqual(times)
  })

  /** The link in the newest mail to `email`, for a person with no account yet: the site admin's Outbox shows all mail. */
  async function invitationToken(email: string): Promise<string> {
    return tokenOf(await linkInMail(postmaster, email, '/invite/'), '/invite/')
  }
})
