/**
 * Reduces long spectra to what a chart can show: at most two points (the lowest and the highest)
 * per horizontal bucket, so narrow lines keep their peaks and troughs at any zoom, and a gap stays
 * a gap. Pure functions on array-likes; the results are fresh Float64Arrays (NaN = no value).
 */

/** A column of a spectrum: a number per point, null (or NaN) where undefined. */
export type SpectrumColumn = ArrayLike<number | null>

/** Points to draw, x ascending; y NaN marks a gap in the line. */
export interface XYPoints {
  x: Float64Array
  y: Float64Array
}

const isValue = (v: number | null | undefined): v is number => v != null && !Number.isNaN(v)

/**
 * Index range [from, to) of the points whose x lies in [startX, endX], widened by one point on
 * each side so a line drawn from it reaches the edges of the window. x must be ascending.
 */
export function indexWindow(
  x: SpectrumColumn,
  startX: number,
  endX: number,
): { from: number; to: number } {
  const from = Math.max(0, lowerBound(x, startX) - 1)
  const to = Math.min(x.length, upperBound(x, endX) + 1)
  return { from, to: Math.max(from, to) }
}

/** First index whose x is ≥ value (binary search on ascending x). */
function lowerBound(x: SpectrumColumn, value: number): number {
  let lo = 0
  let hi = x.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if ((x[mid] ?? -Infinity) < value) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** First index whose x is > value. */
function upperBound(x: SpectrumColumn, value: number): number {
  let lo = 0
  let hi = x.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if ((x[mid] ?? -Infinity) <= value) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** Points [from, to) as they are (null becomes NaN); points without an x are left out. */
export function slicePoints(
  x: SpectrumColumn,
  y: SpectrumColumn,
  from = 0,
  to = x.length,
): XYPoints {
  const outX = new Float64Array(Math.max(0, to - from))
  const outY = new Float64Array(outX.length)
  let n = 0
  for (let i = from; i < to; i++) {
    const xi = x[i]
    if (!isValue(xi)) continue
    const yi = y[i]
    outX[n] = xi
    outY[n] = isValue(yi) ? yi : NaN
    n++
  }
  return { x: outX.subarray(0, n), y: outY.subarray(0, n) }
}

/**
 * Min–max reduction of points [from, to) into `bucketCount` buckets of equal width in x (the
 * grid may be far from uniform, pixels are not).
 *
 * Method: each bucket keeps its lowest and highest point, in their original order, at their own
 * x; a bucket holding a missing value also keeps one gap marker (y NaN) at that point's x, so
 * lines stay broken where the data are. Runs of markers collapse to one. The first and last
 * points are kept too, so the line spans the whole range.
 *
 * Notes: x must be ascending; the output x is then ascending too. At most 2·bucketCount + 2
 * points (3·bucketCount + 2 with missing values). Inputs of at most 2·bucketCount points come
 * back unchanged.
 */
export function minMaxDownsample(
  x: SpectrumColumn,
  y: SpectrumColumn,
  bucketCount: number,
  from = 0,
  to = x.length,
): XYPoints {
  const buckets = Math.max(1, Math.floor(bucketCount))
  if (to - from <= 2 * buckets) return slicePoints(x, y, from, to)

  let first = from
  while (first < to && !isValue(x[first])) first++
  let last = to - 1
  while (last >= first && !isValue(x[last])) last--
  if (first > last) return { x: new Float64Array(0), y: new Float64Array(0) }
  const x0 = x[first] as number
  const span = (x[last] as number) - x0
  const perUnit = span > 0 ? buckets / span : 0

  const outX = new Float64Array(3 * buckets + 2)
  const outY = new Float64Array(3 * buckets + 2)
  let n = 0
  const emit = (i: number, gap: boolean) => {
    if (gap && n > 0 && Number.isNaN(outY[n - 1])) return
    outX[n] = x[i] as number
    outY[n] = gap ? NaN : (y[i] as number)
    n++
  }

  // Scratch for one bucket's picks: ends of the range, lowest, highest, gap.
  const picks = new Int32Array(5)
  let bucket = -1
  let minI = -1
  let maxI = -1
  let minV = Infinity
  let maxV = -Infinity
  let gapI = -1
  let edgeI = isValue(y[first]) ? first : -1
  let count = 0
  const pick = (i: number) => {
    if (i < 0) return
    for (let k = 0; k < count; k++) if (picks[k] === i) return
    let k = count++
    while (k > 0 && picks[k - 1] > i) {
      picks[k] = picks[k - 1]
      k--
    }
    picks[k] = i
  }
  const flush = (lastI = -1) => {
    // In index order, so x stays ascending.
    count = 0
    pick(edgeI)
    pick(lastI)
    pick(minI)
    pick(maxI)
    pick(gapI)
    for (let k = 0; k < count; k++) emit(picks[k], picks[k] === gapI)
  }
  for (let i = first; i <= last; i++) {
    const xi = x[i]
    if (xi == null || xi !== xi) continue
    const b = Math.min(buckets - 1, Math.floor((xi - x0) * perUnit))
    if (b !== bucket) {
      flush()
      bucket = b
      minI = maxI = gapI = edgeI = -1
      minV = Infinity
      maxV = -Infinity
    }
    const yi = y[i]
    if (yi == null || yi !== yi) {
      if (gapI < 0) gapI = i
      continue
    }
    if (yi < minV) {
      minI = i
      minV = yi
    }
    if (yi > maxV) {
      maxI = i
      maxV = yi
    }
  }
  flush(isValue(y[last]) ? last : -1)
  return { x: outX.slice(0, n), y: outY.slice(0, n) }
}

/** How many points a view may draw per series, and how finely it reduces longer stretches. */
export interface ViewBudget {
  /** A window holding at most this many points is drawn point by point. */
  fullResolutionMaxPoints: number
  /** Buckets of the min–max reduction of a longer window. */
  bucketCount: number
}

/**
 * The points of one series for a chart zoomed to [startX, endX]: inside the window at full
 * resolution when it holds few enough points, else min–max reduced; outside it the `context`
 * points (a coarse overview of the whole series), so a range slider still shows everything.
 */
export function pointsForWindow(
  x: SpectrumColumn,
  y: SpectrumColumn,
  startX: number,
  endX: number,
  budget: ViewBudget,
  context?: XYPoints,
): XYPoints {
  const { from, to } = indexWindow(x, startX, endX)
  const inside =
    to - from <= budget.fullResolutionMaxPoints
      ? slicePoints(x, y, from, to)
      : minMaxDownsample(x, y, budget.bucketCount, from, to)
  if (!context || inside.x.length === 0) return inside
  const before = lowerBound(context.x, inside.x[0])
  const after = upperBound(context.x, inside.x[inside.x.length - 1])
  const count = before + inside.x.length + (context.x.length - after)
  const out: XYPoints = { x: new Float64Array(count), y: new Float64Array(count) }
  out.x.set(context.x.subarray(0, before))
  out.y.set(context.y.subarray(0, before))
  out.x.set(inside.x, before)
  out.y.set(inside.y, before)
  out.x.set(context.x.subarray(after), before + inside.x.length)
  out.y.set(context.y.subarray(after), before + inside.x.length)
  return out
}

/**
 * Lowest and highest y of the points with x in [startX, endX] (only positive ones when
 * `positiveOnly`, for a log axis); null when there is none.
 */
export function valueExtent(
  points: XYPoints,
  startX: number,
  endX: number,
  positiveOnly = false,
): [number, number] | null {
  let lo = Infinity
  let hi = -Infinity
  const start = lowerBound(points.x, startX)
  for (let i = start; i < points.x.length && points.x[i] <= endX; i++) {
    const v = points.y[i]
    if (Number.isNaN(v) || (positiveOnly && v <= 0)) continue
    if (v < lo) lo = v
    if (v > hi) hi = v
  }
  return lo <= hi ? [lo, hi] : null
}
