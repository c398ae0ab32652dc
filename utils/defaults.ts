/**
 * Defaults a screen starts from, in one place. None of them names a catalogue row: they are
 * read from the catalogue as it stands, so a change to the jar catalogue or the recipes needs
 * no change here.
 */

/** Jars on the first line of a new plan: two loads of pints in a common 16-quart canner (common practice, no published source). */
const STARTER_JARS = 18
/** Best-by months for a new household: "use within about a year" (OSU EM 9435). */
export const DEFAULT_BEST_BY_MONTHS = 12
/** Jars on a line added to a plan. */
export const ADDED_LINE_JARS = 9

interface CatalogueRecipe { id: string, status: string, ingredientId: string | null, processMinutes: ReadonlyArray<{ jarKey: string }>, retired?: string | null }
interface CatalogueJar { id: string, sizeKey: string, mouth: string }

/**
 * The first line of a new plan: the first tested recipe of the Recipe book still in the library, in the first jar
 * size of its process table (a regular-mouth jar where there is one), with its own bean.
 */
export function starterLine(recipes: readonly CatalogueRecipe[], jarSizes: readonly CatalogueJar[]) {
  const plannable = recipes.filter(r => !r.retired)
  const recipe = plannable.find(r => r.status === 'tested') ?? plannable[0]
  const jar = firstJarFor(recipe, jarSizes)
  if (!recipe || !jar) return null
  return { recipeId: recipe.id, jarSizeId: jar.id, ...(recipe.ingredientId ? { ingredientId: recipe.ingredientId } : {}), jars: STARTER_JARS }
}

/** The first jar of the catalogue in the first size a recipe's process table covers. */
export function firstJarFor(recipe: CatalogueRecipe | undefined, jarSizes: readonly CatalogueJar[]): CatalogueJar | undefined {
  const sizeKey = recipe?.processMinutes[0]?.jarKey
  const inSize = jarSizes.filter(j => j.sizeKey === sizeKey)
  return inSize.find(j => j.mouth === 'regular') ?? inSize[0] ?? jarSizes[0]
}

/** The largest photo a load takes, checked by the photo route and, to spare a slow upload, by the page. */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024

/** The largest Shelf inventory CSV an import takes (about 2,000 lots with room to spare). */
export const MAX_CSV_BYTES = 2 * 1024 * 1024

/**
 * The most a request body may hold, by the kind of route, enforced before the body is read
 * (`server/middleware/02.body-limit.ts`): a Content-Length above it is refused at once, and a
 * chunked body is counted as it streams and refused at the limit. A body that stops arriving
 * (a Content-Length promising more than is sent) is cut off after `idleMs` without a byte, and
 * any body after `totalMs`.
 */
export const BODY_LIMITS = {
  json: 256 * 1024,
  csvImport: MAX_CSV_BYTES + 64 * 1024,
  /** The photo plus the multipart envelope around it. */
  photoUpload: MAX_PHOTO_BYTES + 64 * 1024,
  idleMs: 10_000,
  totalMs: 120_000,
} as const

/**
 * Every date and time a request carries (a load's times, the Logbook's range, a CSV's canned
 * date, a gauge test) must fall in these years: PostgreSQL has no year 0, and a date near 9999
 * overflows once a reminder or best-by date is added to it.
 */
export const PLAUSIBLE_YEARS = { first: 1970, last: 2200 } as const

/** An invitation link stays good this long (then the owner resends it). */
export const INVITATION_DAYS = 7
/** A password-reset link stays good this long. */
export const RESET_LINK_MINUTES = 60
