/** Dates and times as a home canner reads them, in the browser's own time zone. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—'
  const d = iso.length === 10 ? new Date(`${iso}T12:00:00`) : new Date(iso)
  return d.toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: 'numeric' })
}

export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—'
  return new Date(iso).toLocaleString('en-US', { weekday: 'short', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' })
}

/** "in 3 h", "5 h ago", measured from `now` (the server's clock). */
export function relativeHours(iso: string, now: string): string {
  const hours = Math.round((Date.parse(iso) - Date.parse(now)) / 3_600_000)
  if (hours === 0) return 'now'
  return hours > 0 ? `in ${hours} h` : `${-hours} h ago`
}

/** A Date as the value of <input type="datetime-local"> (local wall-clock time). */
export function toLocalInput(d: Date): string {
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16)
}

export function percent(rate: number | null): string {
  return rate === null ? '—' : `${Math.round(rate * 100)}%`
}

export const jarSizeShort = (id: string) => id.replace(/-regular$/, '').replace(/-wide$/, ' (wide)').replace(/-/g, ' ')
