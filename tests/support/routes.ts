import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

/** "POST /api/households/:id/loads" for each route file under server/api (method from the file name, GET by default). */
export function routesFromFiles(dir = 'server/api'): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) return routesFromFiles(path)
    const m = relative('server', path).match(/^(.*?)(?:\.(get|post|put|patch|delete))?\.ts$/)!
    const route = `/${m[1]!}`.replace(/\/index$/, '').replace(/\[([^\]]+)\]/g, ':$1')
    return [`${(m[2] ?? 'get').toUpperCase()} ${route}`]
  })
}
