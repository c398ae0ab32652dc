/**
 * The house pattern, checked in the source: components never fetch (pages wire composables to
 * them), every page and component reads the API through a composable, the server reads its
 * environment in one module, and code reaches across top-level folders through the `~~/` alias.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'

function filesUnder(dir: string, ext: RegExp): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    return statSync(path).isDirectory() ? filesUnder(path, ext) : ext.test(name) ? [path] : []
  })
}
const FETCHING = /\$fetch\b|\buse(Lazy)?Fetch\b|\buse(Lazy)?AsyncData\b|\bfetch\(/

describe('the house pattern', () => {
  const components = filesUnder('components', /\.vue$/)
  const pages = filesUnder('pages', /\.vue$/)

  it('finds the components and pages', () => {
    expect(components.length).toBeGreaterThan(20)
    expect(pages.length).toBeGreaterThan(10)
  })

  it('detects a fetch when there is one', () => {
    expect('const x = await $fetch(`/api/x`)').toMatch(FETCHING)
    expect('const { data } = useFetch(\'/api/x\')').toMatch(FETCHING)
  })

  it.each([...filesUnder('components', /\.vue$/), ...filesUnder('pages', /\.vue$/)])('%s does not fetch; a composable does', (file) => {
    const offending = readFileSync(file, 'utf8').split('\n').map((line, i) => ({ line, n: i + 1 })).filter(({ line }) => FETCHING.test(line))
    expect(offending.map(o => `${file}:${o.n}: ${o.line.trim()}`)).toEqual([])
  })

  const serverFiles = filesUnder('server', /\.ts$/)
  it.each(serverFiles.filter(f => !f.endsWith(join('utils', 'settings.ts')) && !f.endsWith('dataDir.ts')))('%s reads no environment variable itself', (file) => {
    expect(readFileSync(file, 'utf8')).not.toMatch(/process\.env/)
  })

  const DEEP = /from\s+['"](\.\.\/){2,}/
  it('detects a deep relative import when there is one', () => {
    expect('import { x } from \'../../utils/x\'').toMatch(DEEP)
    expect('import { x } from \'~~/utils/x\'').not.toMatch(DEEP)
  })

  // The schema is loaded by drizzle-kit, which knows no Nuxt alias.
  const sources = [...serverFiles, ...components, ...pages, ...filesUnder('composables', /\.ts$/), ...filesUnder('utils', /\.ts$/), ...filesUnder('tests', /\.ts$/)]
    .filter(f => !f.includes(join('database', 'schema', '')))
  it.each(sources)('%s imports across folders through ~~/, not ../../', (file) => {
    expect(readFileSync(file, 'utf8')).not.toMatch(DEEP)
  })

  it.each(filesUnder(join('tests', 'nuxt'), /\.test\.ts$/))('%s sits in the folder of the components it tests', (file) => {
    const folder = file.split(/[\\/]/).at(-2)
    const tested = [...readFileSync(file, 'utf8').matchAll(/from '~\/components\/([^/]+)\//g)].map(m => m[1])
    expect(tested.length).toBeGreaterThan(0)
    expect(new Set(tested)).toEqual(new Set([folder]))
  })
})
