/**
 * The house pattern, checked in the source: components never fetch (pages wire composables to
 * them), and every page and component reads the API through a composable.
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
})
