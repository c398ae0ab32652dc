/**
 * With a movable test clock (SHELFSTEAD_TEST_CLOCK=1 or development), every request first takes up
 * the clock as moved by any server on this database. A production server skips this entirely.
 */
export default defineEventHandler(async () => {
  if (!clockAdjustable() || !isDatabaseReady()) return
  await syncClock(await useDB())
})
