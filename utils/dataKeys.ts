/**
 * The one cache key of each endpoint the pages read. A composable reads under its key and a
 * write refreshes the keys whose answers it changes, so two screens never hold two copies of
 * the same answer.
 */
type Id = string | null | undefined

export const dataKeys = {
  me: 'auth-me',
  jarSizes: 'jar-sizes',
  ingredients: 'ingredients',
  outbox: 'dev-outbox',
  mailQueue: 'dev-mail-queue',
  household: (hid: Id) => `household:${hid}`,
  members: (hid: Id) => `members:${hid}`,
  invitations: (hid: Id) => `invitations:${hid}`,
  activity: (hid: Id, page: number) => `activity:${hid}:${page}`,
  invitation: (token: string) => `invitation:${token}`,
  resetLink: (token: string) => `reset-link:${token}`,
  canners: (hid: Id) => `canners:${hid}`,
  prices: (hid: Id) => `prices:${hid}`,
  jarStock: (hid: Id) => `jar-stock:${hid}`,
  dryGoods: (hid: Id) => `dry-goods:${hid}`,
  recipes: (hid: Id) => `recipes:${hid}`,
  recipe: (hid: Id, recipeId: Id) => `recipe:${hid}:${recipeId}`,
  plans: (hid: Id) => `plans:${hid}`,
  plan: (hid: Id, planId: Id) => `plan:${hid}:${planId}`,
  market: (hid: Id, planId: Id) => `market:${hid}:${planId}`,
  loads: (hid: Id) => `loads:${hid}`,
  load: (hid: Id, loadId: Id) => `load:${hid}:${loadId}`,
  shelf: (hid: Id) => `shelf:${hid}`,
  shelfLot: (hid: Id, lotId: Id) => `shelf-lot:${hid}:${lotId}`,
  labels: (hid: Id) => `labels:${hid}`,
  board: (hid: Id) => `board:${hid}`,
} as const
