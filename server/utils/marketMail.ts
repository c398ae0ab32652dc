import { and, eq } from 'drizzle-orm'
import type { Database } from './database'
import { computePlan, requirePlan } from './plans'

const money = (cents: number | null) => (cents === null ? 'no price' : `$${(cents / 100).toFixed(2)}`)

/** The Market list of a saved plan, recomputed from current prices, sent to one member. */
export async function sendMarketList(db: Database, householdId: string, planId: string, userId: string, senderName: string) {
  const plan = await requirePlan(db, householdId, planId)
  const [member] = await db.select({ email: tables.users.email, name: tables.users.name })
    .from(tables.memberships).innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.userId, userId)))
  if (!member) {
    badInput('userId', 'Send the list to a member of this household.')
  }
  const result = await computePlan(db, householdId, plan.request)
  const items = result.shopping.map(item => ({
    item: item.item,
    need: item.display,
    buy: item.packages.map(p => `${p.count} × ${p.label}`).join(', ') || 'no package price on file',
    cost: money(item.cost),
  }))
  const total = result.shopping.reduce((s, i) => s + (i.cost ?? 0), 0)
  const link = `${publicUrl()}/plans/${plan.id}`
  const text = [
    `${senderName} sent you the Market list for "${plan.name}" (${result.totals.jars} jars in ${result.totals.loads} loads).`,
    '',
    ...items.map(i => `- ${i.item}: need ${i.need}; buy ${i.buy} (${i.cost})`),
    '',
    `Total: ${money(total)}`,
    'Lids are single-use: buy one new flat lid per jar. Bands are reused.',
    '',
    `Check items off as you shop: ${link}`,
  ].join('\n')
  const html = `<p>${escapeHtml(senderName)} sent you the Market list for <strong>${escapeHtml(plan.name)}</strong> (${result.totals.jars} jars in ${result.totals.loads} loads).</p>`
    + `<table cellpadding="6" style="border-collapse:collapse"><thead><tr><th align="left">Item</th><th align="left">Need</th><th align="left">Buy</th><th align="right">Cost</th></tr></thead><tbody>`
    + items.map(i => `<tr><td>${escapeHtml(i.item)}</td><td>${escapeHtml(i.need)}</td><td>${escapeHtml(i.buy)}</td><td align="right">${escapeHtml(i.cost)}</td></tr>`).join('')
    + `</tbody></table><p><strong>Total: ${money(total)}</strong></p><p>Lids are single-use: buy one new flat lid per jar. Bands are reused.</p><p><a href="${escapeHtml(link)}">Check items off as you shop</a></p>`
  const sent = await sendMail({ to: [member.email], subject: `Market list: ${plan.name}`, text, html }).catch((error) => {
    if ((error as { statusCode?: number }).statusCode) throw error
    upstreamFailed(`The mail server did not take the message: ${(error as Error).message}`)
  })
  return { sentTo: member.email, items: items.length, messageId: sent.messageId }
}
