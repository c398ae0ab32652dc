import { stringify } from 'csv-stringify/sync'
import { loadCode } from '~~/utils/after'
import { HouseholdParamsSchema } from '~~/utils/schemas/household'
import { LoadListQuerySchema } from '~~/utils/schemas/logbook'

/** The Logbook as CSV, one row per load line, with the same filters as the list (any member). */
export default defineEventHandler(async (event) => {
  const { params: { id }, db } = await requireHouseholdRole(event, HouseholdParamsSchema, 'helper')
  const query = validQuery(event, LoadListQuerySchema)
  const rows = await loadsForExport(db, id, query)
  setResponseHeaders(event, { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="shelfstead-logbook.csv"' })
  return stringify(rows.map(({ load, line }) => ({
    load_code: loadCode(load.number),
    status: load.status,
    started_at: load.startedAt?.toISOString() ?? '',
    ended_at: load.endedAt?.toISOString() ?? '',
    canner: load.cannerName,
    gauge: load.gaugeType,
    pressure_psi: load.pressurePsi ?? '',
    process_minutes: load.processMinutes ?? '',
    required_psi: load.requiredPsi ?? '',
    required_minutes: load.requiredMinutes ?? '',
    flag: load.shortfall?.kind ?? '',
    product: line.product,
    recipe_id: line.recipeId ?? '',
    jar_size: line.jarSizeId,
    jars: line.jars,
    sealed: line.sealed ?? '',
    unsealed: line.unsealed ?? '',
    unsealed_action: line.unsealedAction ?? '',
    notes: load.notes,
  })), { header: true, columns: ['load_code', 'status', 'started_at', 'ended_at', 'canner', 'gauge', 'pressure_psi', 'process_minutes', 'required_psi', 'required_minutes', 'flag', 'product', 'recipe_id', 'jar_size', 'jars', 'sealed', 'unsealed', 'unsealed_action', 'notes'] })
})
