import { createServer } from 'node:net'

/** A loopback port that was free a moment ago (tests, benchmarks). */
export function freePort() {
  return new Promise((done, fail) => {
    const probe = createServer()
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      probe.close(() => (typeof address === 'object' && address ? done(address.port) : fail(new Error('no port'))))
    })
  })
}
