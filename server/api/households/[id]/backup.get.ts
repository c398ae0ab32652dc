import { HouseholdParamsSchema } from '~~/utils/schemas/household'

/** The whole household as one file (README "Backup and restore"); owners only: it holds the members' password hashes. */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'owner')
  const backup = await exportHousehold(db, id, usePhotoStorage())
  setResponseHeaders(event, {
    'content-type': 'application/json; charset=utf-8',
    'content-disposition': `attachment; filename="${backupFileName(backup)}"`,
    'cache-control': 'no-store',
  })
  return backup
})
