// The command-line tools reuse the server's own code (settings, data-directory lock, database,
// backup) rather than a second copy: jiti runs its TypeScript with Nuxt's root alias.
import { fileURLToPath } from 'node:url'
import { createJiti } from 'jiti'

const root = fileURLToPath(new URL('../..', import.meta.url))
const jiti = createJiti(import.meta.url, { alias: { '~~': root, '~': root } })

/** Import a file of the project by its path from the project root. */
export const serverCode = path => jiti.import(new URL(`../../${path}`, import.meta.url).href)

/** Print the reason a command cannot go ahead and end with status 1. */
export function refuse(message) {
  console.error(`[shelfstead] ${message}`)
  process.exit(1)
}
