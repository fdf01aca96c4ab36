/** A greyscale raster: one byte per pixel (0 black … 255 white), rows top to bottom. */
export interface GreyRaster {
  data: Uint8Array;
  widthPx: number;
  heightPx: number;
}

/** Pixel rectangle inside a raster, in pixels from its top-left corner. */
export interface PixelRect {
  leftPx: number;
  topPx: number;
  widthPx: number;
  heightPx: number;
}

/** The rectangle clamped to the raster; the whole raster when none is given. */
export function clampRect(raster: Pick<GreyRaster, "widthPx" | "heightPx">, rect?: PixelRect): PixelRect {
  if (!rect) return { leftPx: 0, topPx: 0, widthPx: raster.widthPx, heightPx: raster.heightPx };
  const left = Math.max(0, Math.min(raster.widthPx, Math.floor(rect.leftPx)));
  const top = Math.max(0, Math.min(raster.heightPx, Math.floor(rect.topPx)));
  const right = Math.max(left, Math.min(raster.widthPx, Math.floor(rect.leftPx + rect.widthPx)));
  const bottom = Math.max(top, Math.min(raster.heightPx, Math.floor(rect.topPx + rect.heightPx)));
  return { leftPx: left, topPx: top, widthPx: right - left, heightPx: bottom - top };
}

/** Counts of each grey level 0…255 inside `rect` (default: the whole raster). */
export function greyHistogram(raster: GreyRaster, rect?: PixelRect): Uint32Array {
  const histogram = new Uint32Array(256);
  const r = clampRect(raster, rect);
  const { data, widthPx } = raster;
  for (let y = r.topPx; y < r.topPx + r.heightPx; y++) {
    const row = y * widthPx;
    for (let i = row + r.leftPx, end = row + r.leftPx + r.widthPx; i < end; i++) histogram[data[i]]++;
  }
  return histogram;
}

export interface OtsuResult {
  /** Levels 0…threshold form the dark class, threshold+1…L−1 the light class. */
  threshold: number;
  /** σ_B² at the threshold, in grey levels squared. */
  betweenClassVariance: number;
}

/**
 * Otsu's threshold (N. Otsu, IEEE Trans. SMC 9(1):62–66, 1979): the split k of the histogram into levels ≤ k and
 * > k that maximises the between-class variance σ_B²(k) = (μ_T·ω(k) − μ(k))² / (ω(k)·(1 − ω(k))), with ω(k)
 * the share of pixels ≤ k, μ(k) their first moment and μ_T the mean level. Compared exactly in integers, so
 * ties are real ties; when several k tie (empty levels between the two modes), the middle of them is taken,
 * which keeps the cut away from both modes. A histogram with one occupied level v has nothing to split: v goes
 * to the dark class when v < L/2 (threshold v), else to the light class (threshold v − 1). Works for any number of levels L = histogram.length.
 */
export function otsuThreshold(histogram: ArrayLike<number>): OtsuResult {
  const levels = histogram.length;
  let total = 0n;
  let sumAll = 0n;
  for (let i = 0; i < levels; i++) {
    const count = BigInt(histogram[i]);
    total += count;
    sumAll += BigInt(i) * count;
  }
  if (total === 0n) return { threshold: 0, betweenClassVariance: 0 };
  // σ_B² · N² = (N·S_k − S_T·W_k)² / (W_k·(N − W_k)); keep the best as a fraction num/den.
  let bestNum = -1n;
  let bestDen = 1n;
  const ties: number[] = [];
  let w = 0n;
  let s = 0n;
  for (let k = 0; k < levels - 1; k++) {
    const count = BigInt(histogram[k]);
    w += count;
    s += BigInt(k) * count;
    if (w === 0n || w === total) continue;
    const diff = total * s - sumAll * w;
    const num = diff * diff;
    const den = w * (total - w);
    const cmp = num * bestDen - bestNum * den;
    if (bestNum < 0n || cmp > 0n) {
      bestNum = num;
      bestDen = den;
      ties.length = 0;
      ties.push(k);
    } else if (cmp === 0n) ties.push(k);
  }
  if (ties.length === 0) {
    // One occupied level: nothing to split, so it goes to the dark class if it is in the lower half.
    let level = 0;
    while (Number(histogram[level]) === 0) level++;
    return { threshold: level < levels / 2 ? level : level - 1, betweenClassVariance: 0 };
  }
  const threshold = ties[Math.floor((ties.length - 1) / 2)];
  const n = Number(total);
  return { threshold, betweenClassVariance: Number(bestNum) / Number(bestDen) / (n * n) };
}
