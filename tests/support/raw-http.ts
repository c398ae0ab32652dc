/**
 * Requests that fetch cannot make: a body streamed until the server answers (to see a refusal
 * arrive before the body is sent whole), and a Content-Length that promises more than is sent.
 * Raw sockets, so an answer that comes while the body is still being written is read, not lost
 * to EPIPE.
 */
import { readFileSync } from 'node:fs'
import net from 'node:net'

export interface RawAnswer {
  /** The HTTP status, or 0 when the connection closed without an answer. */
  status: number
  /** The JSON body of the answer, when it has one. */
  body: any // eslint-disable-line @typescript-eslint/no-explicit-any -- test JSON
  /** Body bytes written before the answer came (or the connection closed). */
  sent: number
  ms: number
}

function parseAnswer(raw: string): { status: number, body: unknown } {
  const status = Number(/^HTTP\/1\.1 (\d{3})/.exec(raw)?.[1] ?? 0)
  const text = raw.slice(raw.indexOf('\r\n\r\n') + 4)
  // Chunked answer: take the JSON object inside the chunk framing.
  const json = text.slice(text.indexOf('{'), text.lastIndexOf('}') + 1)
  try { return { status, body: JSON.parse(json) } }
  catch { return { status, body: null } }
}

/**
 * Send `head` (request line and headers, without the blank line), then body bytes from `next`
 * until it returns null, the server answers, or the connection closes; `end` finishes the body.
 * Waits at most `waitMs` after the last write for the answer.
 */
export function rawRequest(port: number, head: string, next: () => Buffer | null, options: { waitMs?: number, end?: Buffer } = {}): Promise<RawAnswer> {
  const started = Date.now()
  return new Promise((resolve) => {
    const socket = net.connect(port, '127.0.0.1')
    let raw = ''
    let sent = 0
    let answered = false
    let finished = false
    let timer: NodeJS.Timeout | undefined
    const finish = () => {
      if (finished) return
      finished = true
      clearTimeout(timer)
      socket.destroy()
      resolve({ ...parseAnswer(raw), sent, ms: Date.now() - started })
    }
    socket.on('data', (chunk) => {
      raw += chunk.toString()
      answered = true
      // The whole answer is in once its JSON closes (answers here are small).
      if (/\r\n\r\n[\s\S]*\}\s*(\r\n0\r\n\r\n)?$/.test(raw)) setTimeout(finish, 50)
    })
    socket.on('error', () => { /* EPIPE / ECONNRESET after a refusal: the answer read so far counts */ })
    socket.on('close', finish)
    socket.write(`${head}\r\n\r\n`)
    // One chunk a turn of the event loop, so an answer that arrives mid-body is seen at once.
    const pump = () => {
      if (answered || finished) return
      const chunk = next()
      if (!chunk) {
        if (options.end) socket.write(options.end)
        timer = setTimeout(finish, options.waitMs ?? 30_000)
        return
      }
      sent += chunk.byteLength
      if (socket.write(chunk)) setImmediate(pump)
      else socket.once('drain', () => setImmediate(pump))
    }
    socket.once('connect', pump)
  })
}

/** `total` bytes of `fill`, in chunked transfer framing, 64 KB a chunk. */
export function chunkedBody(total: number, fill: Buffer = Buffer.alloc(64 * 1024, 'a'), prefix?: Buffer): () => Buffer | null {
  let left = total
  let first = prefix
  return () => {
    if (left <= 0) return null
    const data = first ?? fill.subarray(0, Math.min(fill.byteLength, left))
    first = undefined
    left -= data.byteLength
    return Buffer.concat([Buffer.from(`${data.byteLength.toString(16)}\r\n`), data, Buffer.from('\r\n')])
  }
}
export const CHUNKED_END = Buffer.from('0\r\n\r\n')

/** The resident memory of a process, in bytes (Linux). */
export function residentBytes(pid: number): number {
  const kb = /VmRSS:\s+(\d+)\s+kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))
  if (!kb) throw new Error(`no VmRSS for ${pid}`)
  return Number(kb[1]) * 1024
}
