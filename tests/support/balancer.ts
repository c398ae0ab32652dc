import { createServer, request, type Server } from 'node:http'
import { freePort } from './ports'

/**
 * One address in front of several app servers, as a load balancer would be: each request goes to
 * the next server in turn (round robin), so consecutive requests of one client land on different
 * servers. Counts what each server answered.
 */
export async function startBalancer(backends: string[]): Promise<{ url: string, served: number[], stop: () => Promise<void> }> {
  const served = backends.map(() => 0)
  let next = 0
  const server: Server = createServer((req, res) => {
    const index = next++ % backends.length
    const target = new URL(req.url ?? '/', backends[index])
    // The Host header stays the balancer's, as behind a real proxy: the servers see one site.
    const upstream = request(target, { method: req.method, headers: req.headers }, (answer) => {
      served[index]!++
      res.writeHead(answer.statusCode ?? 502, answer.headers)
      answer.pipe(res)
    })
    upstream.on('error', () => {
      res.writeHead(502).end()
    })
    req.pipe(upstream)
  })
  const port = await freePort()
  await new Promise<void>(done => server.listen(port, '127.0.0.1', done))
  return {
    url: `http://127.0.0.1:${port}`,
    served,
    stop: () => new Promise<void>(done => server.close(() => done())),
  }
}
