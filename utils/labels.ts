/**
 * What a jar label's QR code holds: the address of the lot's own page, where one tap takes a jar
 * off the Shelf. The code is drawn from the `qrcode` package's module matrix.
 */
import QRCode from 'qrcode'
import type { LabelLayout } from './vocabulary'

/**
 * The label stock Shelfstead prints on, with the labels one page holds. The sheets follow the
 * common stock sizes: US letter with 30 labels of 1 × 2⅝ in (3 × 10), A4 with 24 labels of
 * 70 × 37 mm (3 × 8, edge to edge); plain paper gets 21 labels of 1¼ × 2.3 in to cut out, which
 * fit both letter and A4 inside ½ in margins. The page's CSS draws the same sizes.
 */
export const labelSheets: Record<LabelLayout, { perPage: number, name: string }> = {
  'sheet-30': { perPage: 30, name: 'Label sheet, 30 per page (1 × 2⅝ in, US letter)' },
  'a4-24': { perPage: 24, name: 'Label sheet, 24 per page (70 × 37 mm, A4)' },
  'plain': { perPage: 21, name: 'Plain paper, 21 per page (cut out)' },
}

/**
 * The lot's page from `base`, the address people open Shelfstead at (SHELFSTEAD_PUBLIC_URL, or
 * the origin the labels page was opened from): `https://jars.example/shelf/lots/<id>`.
 */
export function lotLink(base: string, lotId: string): string {
  const url = new URL(base)
  url.pathname = `${url.pathname.replace(/\/+$/, '')}/shelf/lots/${encodeURIComponent(lotId)}`
  url.search = ''
  url.hash = ''
  return url.href
}

/** True when `base` names this computer only (localhost, 127.x, ::1): a phone cannot open it. */
export function isLoopbackBase(base: string): boolean {
  const host = new URL(base).hostname.replace(/^\[|\]$/g, '')
  return host === 'localhost' || host.endsWith('.localhost') || host === '::1' || host === '0.0.0.0' || /^127\.\d+\.\d+\.\d+$/.test(host)
}

export interface QrModules {
  /** Modules per side, without the quiet zone. */
  size: number
  dark: (x: number, y: number) => boolean
}

/** The QR code of `text` (error correction M, about 15 % of the code may be smudged). */
export function qrModules(text: string): QrModules {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' })
  return { size: modules.size, dark: (x, y) => Boolean(modules.get(y, x)) }
}

/** An SVG path of the dark modules, one rectangle per run in a row, in module units. */
export function qrPath(qr: QrModules): string {
  let path = ''
  for (let y = 0; y < qr.size; y++) {
    for (let x = 0; x < qr.size; x++) {
      if (!qr.dark(x, y)) continue
      let run = 1
      while (x + run < qr.size && qr.dark(x + run, y)) run++
      path += `M${x} ${y}h${run}v1h-${run}z`
      x += run
    }
  }
  return path
}
