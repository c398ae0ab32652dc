// A throwaway cluster of Debian's PostgreSQL server (package postgresql) on 127.0.0.1, for the
// tests and the benchmarks. Debian refuses initdb as root, so as root it runs as the postgres user.
import { execFileSync, spawn } from 'node:child_process'
import { chmodSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs'
import { freePort } from './ports.mjs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

/** Debian's PostgreSQL server binaries, newest version first; undefined when not installed. */
export function postgresBin() {
  const root = '/usr/lib/postgresql'
  const versions = existsSync(root) ? readdirSync(root).sort((a, b) => Number(b) - Number(a)) : []
  return versions.map(v => join(root, v, 'bin')).find(b => existsSync(join(b, 'initdb')))
}

/** Start a cluster with one database `shelfstead`; `stop()` ends it and removes its files. */
export async function startPostgres() {
  const bin = postgresBin()
  if (!bin) throw new Error('PostgreSQL server binaries not found: apt-get install postgresql')
  const dir = mkdtempSync(join(tmpdir(), 'shelfstead-pg-'))
  chmodSync(dir, 0o777)
  const dataDir = join(dir, 'data')
  const asRoot = process.getuid?.() === 0
  const run = (cmd, args) => asRoot
    ? execFileSync('runuser', ['-u', 'postgres', '--', cmd, ...args], { stdio: 'pipe' })
    : execFileSync(cmd, args, { stdio: 'pipe' })
  run(join(bin, 'initdb'), ['-D', dataDir, '-U', 'shelfstead', '--auth=trust', '-E', 'UTF8'])
  const port = await freePort()
  const args = ['-D', dataDir, '-p', String(port), '-h', '127.0.0.1', '-k', dir, '-c', 'max_connections=200']
  const server = asRoot
    ? spawn('runuser', ['-u', 'postgres', '--', join(bin, 'postgres'), ...args], { stdio: 'ignore' })
    : spawn(join(bin, 'postgres'), args, { stdio: 'ignore' })
  const deadline = Date.now() + 30_000
  for (;;) {
    try {
      execFileSync(join(bin, 'pg_isready'), ['-h', '127.0.0.1', '-p', String(port)], { stdio: 'ignore' })
      break
    }
    catch {
      if (Date.now() > deadline) throw new Error('PostgreSQL did not start')
      await new Promise(r => setTimeout(r, 200))
    }
  }
  run(join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'shelfstead', 'shelfstead'])
  return {
    url: `postgres://shelfstead@127.0.0.1:${port}/shelfstead`,
    stop: async () => {
      const exited = new Promise(done => server.once('exit', done))
      run(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop'])
      await exited
      rmSync(dir, { recursive: true, force: true })
    },
  }
}
