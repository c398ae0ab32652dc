/**
 * What a jar label's QR code holds: the lot page's address. The code is drawn from the module
 * matrix the label uses (qrModules, qrPath), rasterised here, and read back with an independent
 * decoder (jsQR), so the check is what a phone's camera would read.
 */
import jsQR from 'jsqr'
import { describe, expect, it } from 'vitest'
import { isLoopbackBase, lotLink, qrModules, qrPath, type QrModules } from '~~/utils/labels'

const LOT = '3f2b8c1e-5d4a-4e8f-9b7c-2a1d0e6f5c4b'

/** Black-on-white RGBA pixels of a QR code, `scale` px per module, with the 4-module quiet zone ISO/IEC 18004 asks for. */
function raster(isDark: (x: number, y: number) => boolean, size: number, scale = 4) {
  const side = (size + 8) * scale
  const pixels = new Uint8ClampedArray(side * side * 4).fill(255)
  for (let py = 0; py < side; py++) {
    for (let px = 0; px < side; px++) {
      const x = Math.floor(px / scale) - 4
      const y = Math.floor(py / scale) - 4
      if (x >= 0 && y >= 0 && x < size && y < size && isDark(x, y)) pixels.fill(0, (py * side + px) * 4, (py * side + px) * 4 + 3)
    }
  }
  return { pixels, side }
}
const decode = (qr: QrModules) => {
  const { pixels, side } = raster(qr.dark, qr.size)
  return jsQR(pixels, side, side)?.data ?? null
}

/** The modules an SVG path of "M x y h n v1 h-n z" runs covers. */
function pathModules(path: string, size: number): QrModules {
  const dark = new Set<string>()
  for (const [, x, y, n] of path.matchAll(/M(\d+) (\d+)h(\d+)v1h-\d+z/g)) {
    for (let i = 0; i < Number(n); i++) dark.add(`${Number(x) + i},${y}`)
  }
  return { size, dark: (x, y) => dark.has(`${x},${y}`) }
}

describe('the jar label QR payload', () => {
  it('is the lot page at the public address', () => {
    expect(lotLink('https://jars.example', LOT)).toBe(`https://jars.example/shelf/lots/${LOT}`)
    expect(lotLink('https://jars.example/', LOT)).toBe(`https://jars.example/shelf/lots/${LOT}`)
    expect(lotLink('http://192.168.1.20:3000', LOT)).toBe(`http://192.168.1.20:3000/shelf/lots/${LOT}`)
    // a Shelfstead served under a path keeps it; a query or fragment of the base is dropped
    expect(lotLink('https://home.example/pantry/?x=1#y', LOT)).toBe(`https://home.example/pantry/shelf/lots/${LOT}`)
  })

  it('tells an address only this computer can open from one a phone can', () => {
    for (const base of ['http://localhost:3000', 'http://127.0.0.1:41234', 'http://[::1]:3000', 'http://app.localhost', 'http://0.0.0.0:3000']) expect(isLoopbackBase(base), base).toBe(true)
    for (const base of ['http://192.168.1.20:3000', 'https://jars.example', 'http://pantry.lan:3000', 'http://10.0.0.7']) expect(isLoopbackBase(base), base).toBe(false)
  })

  it('encodes exactly the link: a decoder reads it back from the code', () => {
    const link = lotLink('http://192.168.1.20:3000', LOT)
    expect(decode(qrModules(link))).toBe(link)
  })

  it('draws the same code as its modules in the SVG path the label prints', () => {
    const link = lotLink('https://shelfstead.home.example', LOT)
    const qr = qrModules(link)
    const drawn = pathModules(qrPath(qr), qr.size)
    expect(decode(drawn)).toBe(link)
    for (let y = 0; y < qr.size; y++) for (let x = 0; x < qr.size; x++) expect(drawn.dark(x, y)).toBe(qr.dark(x, y))
  })

  it('can fail: another lot\'s link decodes to another address', () => {
    expect(decode(qrModules(lotLink('http://192.168.1.20:3000', LOT.replace('3f2b', '4f2b'))))).not.toBe(lotLink('http://192.168.1.20:3000', LOT))
  })
})
