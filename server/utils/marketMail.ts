import { and, eq } from 'drizzle-orm'
import { countOf } from '~~/utils/planning'
import { formatMoney } from '~~/utils/display'
import type { Database } from './database'
import { computePlan, requirePlan } from './plans'
import { deliverQueued, queueMail } from './mailQueue'

/**
 * The Market list of a saved plan, sent to one member: what is still to buy (not yet checked
 * off, not marked as at home), in the packages to buy, for the loads not yet logged; with what is
 * already checked off named after it. Recomputed from current prices and stock.
 */
export async function sendMarketList(db: Database, householdId: string, planId: string, userId: string, senderName: string) {
  if (mailMode() === 'off') unavailable('E-mail is not set up on this server: give SMTP_URL (or SMTP_HOST) and MAIL_FROM.')
  const plan = await requirePlan(db, householdId, planId)
  const [[member], checks] = await Promise.all([
    db.select({ email: tables.users.email, name: tables.users.name })
      .from(tables.memberships).innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
      .where(and(eq(tables.memberships.householdId, householdId), eq(tables.memberships.userId, userId))),
    db.select({ itemKey: tables.marketChecks.itemKey, state: tables.marketChecks.state }).from(tables.marketChecks)
      .where(and(eq(tables.marketChecks.planId, planId), eq(tables.marketChecks.householdId, householdId))),
  ])
  if (!member) {
    badInput('userId', 'Send the list to a member of this household.')
  }
  const result = await computePlan(db, householdId, plan.request, { planId })
  const currency = result.household.currency
  const money = (cents: number | null) => (cents === null ? 'no price on file' : formatMoney(cents, currency))
  const checked = new Set(checks.map(c => c.itemKey))
  const items = result.shopping.map(item => ({
    item: item.item,
    need: item.display,
    buy: item.packages.map(p => `${p.count} × ${p.label}`).join(', ') || 'no package price on file',
    cost: item.cost,
    note: item.note,
    done: checked.has(item.key) || item.atHome,
  }))
  const toBuy = items.filter(i => !i.done)
  const done = items.filter(i => i.done)
  const total = toBuy.reduce((s, i) => s + (i.cost ?? 0), 0)
  const missing = toBuy.filter(i => i.cost === null).map(i => i.item)
  const link = `${publicUrl()}/plans/${plan.id}/market`
  const scope = result.progress.loggedLoads.length
    ? `${countOf(result.progress.jarsLeft, 'jar')} in the ${countOf(result.progress.loadsLeft, 'load')} not yet logged`
    : `${countOf(result.totals.jars, 'jar')} in ${countOf(result.totals.loads, 'load')}`
  const intro = `${senderName} sent you the Market list for "${plan.name}" (${scope}).`
  const totalLine = toBuy.length
    ? `Still to buy: ${money(total)}${missing.length ? ` (no price on file for ${missing.join(', ')})` : ''}`
    : 'Everything on the list is checked off.'
  const doneLine = done.length ? `Already checked off: ${done.map(i => i.item).join(', ')}.` : ''
  const text = [
    intro,
    '',
    ...(toBuy.length ? toBuy.map(i => `- ${i.item}: need ${i.need}; buy ${i.buy} (${money(i.cost)})${i.note ? ` — ${i.note}` : ''}`) : ['Nothing left to buy.']),
    '',
    totalLine,
    ...(doneLine ? [doneLine] : []),
    'Lids are single-use: buy one new flat lid per jar. Bands are reused.',
    '',
    `Check items off as you shop: ${link}`,
  ].join('\n')
  const html = `<p>${escapeHtml(intro)}</p>`
    + (toBuy.length
      ? `<table cellpadding="6" style="border-collapse:collapse"><thead><tr><th align="left">Item</th><th align="left">Need</th><th align="left">Buy</th><th align="right">Cost</th></tr></thead><tbody>`
      + toBuy.map(i => `<tr><td>${escapeHtml(i.item)}${i.note ? `<br><small>${escapeHtml(i.note)}</small>` : ''}</td><td>${escapeHtml(i.need)}</td><td>${escapeHtml(i.buy)}</td><td align="right">${escapeHtml(money(i.cost))}</td></tr>`).join('')
      + `</tbody></table>`
      : '<p>Nothing left to buy.</p>')
    + `<p><strong>${escapeHtml(totalLine)}</strong></p>${doneLine ? `<p>${escapeHtml(doneLine)}</p>` : ''}<p>Lids are single-use: buy one new flat lid per jar. Bands are reused.</p><p><a href="${escapeHtml(link)}">Check items off as you shop</a></p>`
  // Queued first, so a mail server that is down loses nothing: tried now, then retried with backoff.
  const queuedId = await queueMail(db, { kind: 'market-list', householdId, to: [member.email], subject: `Market list: ${plan.name}`, text, html })
  const delivery = await deliverQueued(db, queuedId)
  return { sentTo: member.email, items: toBuy.length, delivered: delivery.sent }
}
