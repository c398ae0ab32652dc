import type { H3Event } from 'h3'
import { BODY_LIMITS } from '~~/utils/defaults'

/**
 * Request bodies are held to a size by the kind of route, before they are read: the middleware
 * `02.body-limit.ts` calls `readBodyWithin` on every request that has a body. The limits are in
 * `utils/defaults.ts` (`BODY_LIMITS`).
 */
interface BodyKind { bytes: number, field: string, tooLarge: string }

const kinds = {
  photoUpload: { bytes: BODY_LIMITS.photoUpload, field: 'photo', tooLarge: 'That photo is larger than 8 MB. Send a smaller one (phones can share a reduced size).' },
  csvImport: { bytes: BODY_LIMITS.csvImport, field: 'csv', tooLarge: 'That file is larger than 2 MB; split it into smaller files.' },
  json: { bytes: BODY_LIMITS.json, field: 'body', tooLarge: 'The form sent more than 256 KB; shorten the longest text and try again.' },
} satisfies Record<string, BodyKind>

const routes: Array<[RegExp, BodyKind]> = [
  [/^\/api\/households\/[^/]+\/loads\/[^/]+\/photos\/?$/, kinds.photoUpload],
  [/^\/api\/households\/[^/]+\/shelf\/import\/?$/, kinds.csvImport],
]

export function bodyKindFor(path: string): BodyKind {
  const pathname = path.split('?')[0]!
  return routes.find(([pattern]) => pattern.test(pathname))?.[1] ?? kinds.json
}

/** How long the rest of a refused body is let in (and dropped) so the sender reads the answer. */
const LINGER_MS = 5_000

/**
 * A refusal. Too large: what is still coming is dropped unread (never held) for at most
 * `LINGER_MS`, then the connection ends; closing at once would reset it under a sender still
 * writing, and it would never see the 413. Stalled: the connection ends with the answer.
 */
function refuse(event: H3Event, refusal: () => never, then: 'linger' | 'close'): never {
  const { req, res } = event.node
  if (then === 'close') setResponseHeader(event, 'connection', 'close')
  else {
    res.once('finish', () => {
      const cut = setTimeout(() => req.socket?.destroy(), LINGER_MS).unref()
      req.once('end', () => clearTimeout(cut)).resume()
    })
  }
  return refusal()
}

/**
 * The body, counted as it streams: 413 as soon as it passes the route's limit (a Content-Length
 * above it is refused unread), 408 when no byte arrives for `idleMs` or it takes over `totalMs`
 * (a Content-Length promising more than is sent). Undefined when the request has no body.
 */
export function readBodyWithin(event: H3Event): Promise<Buffer> | undefined {
  const req = event.node.req
  const declared = req.headers['content-length']
  const chunked = /\bchunked\b/i.test(String(req.headers['transfer-encoding'] ?? ''))
  if (!chunked && (!declared || Number(declared) === 0)) return undefined
  const kind = bodyKindFor(event.path)
  if (Number(declared) > kind.bytes) refuse(event, () => tooLarge(kind.tooLarge, kind.field), 'linger')

  return new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    let done = false
    const stall = () => setTimeout(() => fail(() => timedOut('The request stopped arriving before it was complete; send it again.', kind.field), 'close'), BODY_LIMITS.idleMs)
    let idle = stall()
    const total = setTimeout(() => fail(() => timedOut('The request took too long to arrive; send it again on a steadier connection.', kind.field), 'close'), BODY_LIMITS.totalMs)
    function settle() {
      done = true
      clearTimeout(idle)
      clearTimeout(total)
      req.off('data', onData).off('end', onEnd).off('error', onError).off('close', onClose)
    }
    function fail(refusal: () => never, then: 'linger' | 'close') {
      if (done) return
      settle()
      req.pause()
      try {
        refuse(event, refusal, then)
      }
      catch (error) {
        reject(error)
      }
    }
    function onData(chunk: Buffer) {
      size += chunk.byteLength
      if (size > kind.bytes) return fail(() => tooLarge(kind.tooLarge, kind.field), 'linger')
      chunks.push(chunk)
      clearTimeout(idle)
      idle = stall()
    }
    function onEnd() {
      if (done) return
      settle()
      resolve(Buffer.concat(chunks))
    }
    const cutOff = () => fail(() => badInput(kind.field, 'The request was cut off before it was complete; send it again.'), 'close')
    const onError = cutOff
    const onClose = cutOff
    req.on('data', onData).on('end', onEnd).on('error', onError).on('close', onClose)
  })
}
