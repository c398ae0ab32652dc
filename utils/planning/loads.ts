/**
 * Canner loads: which jars go into which load on which canner.
 *
 * Rules:
 * - Lines share loads only when they use the same jar size and need the same pressure on every
 *   canner in the plan ("a group").
 * - Each load is timed for the longest process time among the jars actually in it, and says so
 *   when its recipes' times differ. Within a group the longest-time lines are loaded first, so
 *   mixing happens only where one line's jars run out.
 * - Slots: a group takes loads one at a time on the canner that is free earliest (then the one
 *   holding more jars), until the slots hold all its jars. With one canner that is
 *   ceil(jars / per load) loads; with two, loads alternate and run side by side.
 * - The jars are spread over the group's loads as evenly as the canners allow (water-filling):
 *   two loads differ by at most one jar unless the smaller one is full.
 */

export interface LoadLine {
  lineIndex: number
  recipeId: string
  jarSizeId: string
  jars: number
  processMinutes: number
  /** Gauge pressure (psi) this line needs on each canner, by canner id. */
  psiByCanner: Readonly<Record<string, number>>
}

export interface CannerFit {
  cannerId: string
  perLayer: number
  layers: number
}

export interface LoadContent {
  lineIndex: number
  recipeId: string
  jars: number
  processMinutes: number
}

export interface Load {
  /** 1-based, in the order the loads are planned. */
  index: number
  cannerId: string
  jarSizeId: string
  jars: number
  perLayer: number
  /** Layers this load uses (bottom layers full). */
  layers: number
  layersAvailable: number
  capacity: number
  jarsByLayer: number[]
  processMinutes: number
  pressurePsi: number
  recipeIds: string[]
  contents: LoadContent[]
  note: string | null
}

/**
 * Spread `total` jars over slots of the given capacities (sum ≥ total) as evenly as possible:
 * every slot gets min(capacity, λ) or λ + 1, with λ the highest level the total allows.
 */
export function spreadEvenly(total: number, capacities: readonly number[]): number[] {
  const filled = (level: number): number => capacities.reduce((s, c) => s + Math.min(c, level), 0)
  let lo = 0
  let hi = Math.max(0, ...capacities)
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2)
    if (filled(mid) <= total) lo = mid
    else hi = mid - 1
  }
  let extra = total - filled(lo)
  return capacities.map((c) => {
    const base = Math.min(c, lo)
    if (extra > 0 && c > lo) {
      extra--
      return base + 1
    }
    return base
  })
}

/** Jars in each layer of a load, bottom first: full layers, then the rest. */
function byLayer(jars: number, perLayer: number): number[] {
  const out: number[] = []
  for (let left = jars; left > 0; left -= perLayer) out.push(Math.min(perLayer, left))
  return out
}

/**
 * Plan the loads for all lines. `fit` gives each canner's jars per layer and layers for a jar
 * size (0 when it does not fit); `minutesPerLoad` the length of one load, used to pick the
 * canner that is free first. Every line must fit at least one canner (the caller refuses first).
 */
export function buildLoads(
  lines: readonly LoadLine[],
  cannerIds: readonly string[],
  fit: (cannerId: string, jarSizeId: string) => CannerFit,
  minutesPerLoad: (jarSizeId: string, processMinutes: number) => number,
): Load[] {
  const groups = new Map<string, LoadLine[]>()
  for (const line of lines) {
    const key = [line.jarSizeId, ...cannerIds.map(id => line.psiByCanner[id])].join('|')
    groups.set(key, [...(groups.get(key) ?? []), line])
  }
  const freeAt = new Map(cannerIds.map(id => [id, 0]))
  const loads: Load[] = []
  for (const group of groups.values()) {
    const jarSizeId = group[0]!.jarSizeId
    const total = group.reduce((s, l) => s + l.jars, 0)
    const longest = Math.max(...group.map(l => l.processMinutes))
    const usable = cannerIds
      .map((id, order) => ({ fit: fit(id, jarSizeId), order }))
      .filter(c => c.fit.perLayer * c.fit.layers > 0)
    const slots: CannerFit[] = []
    for (let held = 0; held < total;) {
      const next = [...usable].sort(
        (a, b) =>
          freeAt.get(a.fit.cannerId)! - freeAt.get(b.fit.cannerId)!
          || b.fit.perLayer * b.fit.layers - a.fit.perLayer * a.fit.layers
          || a.order - b.order,
      )[0]
      if (!next) throw new Error(`no canner holds jar size ${jarSizeId}`)
      slots.push(next.fit)
      held += next.fit.perLayer * next.fit.layers
      freeAt.set(next.fit.cannerId, freeAt.get(next.fit.cannerId)! + minutesPerLoad(jarSizeId, longest))
    }
    const sizes = spreadEvenly(
      total,
      slots.map(s => s.perLayer * s.layers),
    )
    const queue = [...group].sort((a, b) => b.processMinutes - a.processMinutes).map(l => ({ line: l, left: l.jars }))
    slots.forEach((slot, i) => {
      const size = sizes[i]!
      const contents: LoadContent[] = []
      for (let room = size; room > 0;) {
        const head = queue.find(q => q.left > 0)!
        const take = Math.min(room, head.left)
        head.left -= take
        room -= take
        const { lineIndex, recipeId, processMinutes } = head.line
        contents.push({ lineIndex, recipeId, jars: take, processMinutes })
      }
      const minutes = Math.max(...contents.map(c => c.processMinutes))
      const mixed = new Set(contents.map(c => c.processMinutes)).size > 1
      const psi = group[0]!.psiByCanner[slot.cannerId]!
      loads.push({
        index: loads.length + 1,
        cannerId: slot.cannerId,
        jarSizeId,
        jars: size,
        perLayer: slot.perLayer,
        layers: Math.ceil(size / slot.perLayer),
        layersAvailable: slot.layers,
        capacity: slot.perLayer * slot.layers,
        jarsByLayer: byLayer(size, slot.perLayer),
        processMinutes: minutes,
        pressurePsi: psi,
        recipeIds: [...new Set(contents.map(c => c.recipeId))],
        contents,
        note: mixed ? `Recipes with different times share this load: timed for the longest, ${minutes} min.` : null,
      })
    })
  }
  return loads
}
