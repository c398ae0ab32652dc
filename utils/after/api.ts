/** Shapes of the Logbook, seal-check, Shelf and board answers as the pages receive them (JSON: dates are strings). */
export interface ApiLoadLine {
  id: string
  lineIndex: number
  recipeId: string | null
  product: string
  jarSizeId: string
  jars: number
  sealed: number | null
  unsealed: number | null
  unsealedAction: 'refrigerate' | 'reprocess' | null
}

export interface ApiSealWindow { status: 'cooling' | 'due' | 'overdue', dueAt: string, byAt: string, reprocessBy: string }

export interface ApiLoad {
  id: string
  code: string
  number: number
  status: 'done' | 'pending'
  planId: string | null
  planLoadIndex: number | null
  reprocessOfId: string | null
  cannerId: string | null
  cannerName: string
  gaugeType: 'dial' | 'weighted'
  altitudeFt: number
  pressurePsi: number | null
  processMinutes: number | null
  requiredPsi: number | null
  requiredMinutes: number | null
  requiredSource: string | null
  startedAt: string | null
  endedAt: string | null
  deadlineAt: string | null
  shortfall: { kind: string, message: string } | null
  notes: string
  sealCheck: ApiSealWindow | null
  lines: ApiLoadLine[]
}

export interface ApiLoadRow extends ApiLoad {
  jars: number
  checkedAt: string | null
  sealed: number | null
  unsealed: number | null
  photos: number
}

export interface ApiLoadPage { page: number, pageSize: number, total: number, sort: string, now: string, rows: ApiLoadRow[] }

export interface ApiLoadDetail extends ApiLoad {
  now: string
  check: { id: string, checkedAt: string, notes: string, checkedBy: string | null } | null
  photos: Array<{ id: string, contentType: string, bytes: number, originalName: string, createdAt: string }>
  reprocessedIn: Array<{ id: string, code: string, status: string }>
  reprocessOf: { id: string, code: string } | null
}

export interface ApiShelfLot {
  id: string
  product: string
  recipeId: string | null
  jarSizeId: string
  jarSizeName: string
  loadId: string | null
  loadCode: string
  cannedOn: string
  bestBy: string
  jarsIn: number
  jarsLeft: number
  source: 'seal-check' | 'import'
  bestByStatus: 'past' | 'near' | 'ok'
}

export interface ApiFridgeItem { id: string, product: string, jarSizeId: string, jars: number, refrigeratedAt: string, loadId: string, loadCode: string }

export interface ApiShelf {
  today: string
  lots: ApiShelfLot[]
  byProduct: Array<{ product: string, jarSizeId: string, jarSizeName: string, jars: number, lots: number }>
  totalJars: number
  fridge: ApiFridgeItem[]
  lastTakeOff: { batchId: string, movedAt: string, jars: number, items: Array<{ jars: number, product: string, loadCode: string }> } | null
}

export interface ApiRate { id: string, name: string, sealed: number, unsealed: number, rate: number | null }

export interface ApiBoard {
  now: string
  today: string
  shelf: Pick<ApiShelf, 'totalJars' | 'byProduct'>
  sealChecksDue: Array<ApiLoad>
  reprocessing: Array<ApiLoad>
  plansInProgress: Array<{ id: string, name: string, status: string, summary: { jars: number, loads: number, recipes: string[] }, updatedAt: string }>
  pastBestBy: ApiShelfLot[]
  nearBestBy: ApiShelfLot[]
  fridge: ApiFridgeItem[]
  sealRates: { household: { sealed: number, unsealed: number, rate: number | null }, byRecipe: ApiRate[], byCanner: ApiRate[] }
  stockOverTime: Array<{ month: string, jars: number }>
  usedPerMonth: Array<{ month: string, jars: number }>
  jarsUsedPerMonth: Array<{ key: string, product: string, recipeId: string | null, jarSizeId: string, jars: number, months: number, jarsPerMonth: number }>
}
