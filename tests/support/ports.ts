import { createServer } from 'node:net'

/** A loopback port that was free a moment ago. */
export async function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const probe = createServer()
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      probe.close(() => (typeof address === 'object' && address ? done(address.port) : fail(new Error('no port'))))
    })
  })
}
