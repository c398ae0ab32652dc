/** The data-directory lock: a live holder refuses, naming its pid; a crash's lock is taken over, even when its pid was reused. */
import { spawn, type ChildProcess } from 'node:child_process'
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync, chmodSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { lockDataDir, processStartTime } from '~~/server/utils/dataDir'

const children: ChildProcess[] = []
afterAll(() => { for (const c of children) c.kill('SIGKILL') })

/** An unrelated live process (not a Shelfstead server), standing for a reused pid. */
function unrelated(command = 'sleep'): ChildProcess {
  const child = spawn(command, ['30'], { stdio: 'ignore' })
  children.push(child)
  return child
}

const dir = () => mkdtempSync(join(tmpdir(), 'shelfstead-lock-'))
const lockFile = (d: string) => join(d, 'shelfstead.lock')

describe('data-directory lock', () => {
  it('reads process start times from /proc: a process started later has a later start (clock ticks of 1/100 s)', async () => {
    const first = unrelated()
    await new Promise(r => setTimeout(r, 400))
    // a command whose name holds ") (" must not shift the fields
    const odd = join(dir(), 'a) b (c')
    copyFileSync('/bin/sleep', odd)
    chmodSync(odd, 0o755)
    const second = unrelated(odd)
    await new Promise(r => setTimeout(r, 50))
    const a = Number(processStartTime(first.pid!))
    const b = Number(processStartTime(second.pid!))
    expect(b - a).toBeGreaterThanOrEqual(30)
    expect(b - a).toBeLessThan(300)
    expect(processStartTime(2 ** 22 + 7)).toBeNull()
  })

  it('takes over a lock whose pid now belongs to another process (different start time)', () => {
    const d = dir()
    const other = unrelated()
    writeFileSync(lockFile(d), `${other.pid} 12345`)
    const release = lockDataDir(d)
    expect(readFileSync(lockFile(d), 'utf8')).toBe(`${process.pid} ${processStartTime(process.pid)}`)
    release()
  })

  it('refuses while the holder runs (same pid and start time), naming the directory and the pid', () => {
    const d = dir()
    const other = unrelated()
    writeFileSync(lockFile(d), `${other.pid} ${processStartTime(other.pid!)}`)
    expect(() => lockDataDir(d)).toThrow(new RegExp(`${d}.*pid ${other.pid}`))
    expect(readFileSync(lockFile(d), 'utf8')).toContain(String(other.pid))
  })

  it('takes over the lock of a process that has ended', async () => {
    const d = dir()
    const gone = spawn('true')
    await new Promise(r => gone.once('exit', r))
    writeFileSync(lockFile(d), `${gone.pid} 1`)
    lockDataDir(d)()
  })

  it('a lock written with a bare pid (older servers) still refuses while that pid lives', () => {
    const d = dir()
    const other = unrelated()
    writeFileSync(lockFile(d), String(other.pid))
    expect(() => lockDataDir(d)).toThrow(`pid ${other.pid}`)
  })

  it('a data directory that is a file is refused with its path and what to do', () => {
    const file = join(dir(), 'not-a-folder')
    writeFileSync(file, 'x')
    expect(() => lockDataDir(join(file, 'data'))).toThrow(/Cannot use the data directory .*not-a-folder\/data: the path \(or a folder above it\) is a file.*NUXT_DATA_DIR/)
  })

  it('release removes only its own lock', () => {
    const d = dir()
    const release = lockDataDir(d)
    writeFileSync(lockFile(d), '1 1')
    release()
    expect(readFileSync(lockFile(d), 'utf8')).toBe('1 1')
  })
})
