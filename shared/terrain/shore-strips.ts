// Over 300 lines: one shore-strip model (stations, bands watched, gaps, the post to close them) whose steps share the station definition.
import type { GridSpec } from '@/shared/terrain/grid-spec';

/*
 * Strip coverage along a shore: which stretches of a shoreline have each
 * offshore band in view, post by post. Pure, grid metres (x east, y north)
 * inside; chainage and lengths along the shore in geodesic metres.
 *
 * Definition ("shore watched in band b"): the shoreline is cut into stations
 * about one cell long. At each station the offshore transect is the straight
 * line from the station's middle, square to the shoreline, out to sea. A post
 * WATCHES band b at a station when it sees the target at every point of that
 * transect whose distance from the shore lies within b (sampled every half
 * cell, both edges included; a point off the grid is not seen). The station
 * is watched in b by ≥ n posts when at least n posts each watch it. So a
 * watched station has the whole width of the band in view from one post —
 * never two half-views stitched together — and a post's contribution is a
 * yes/no per station, which is what the hour-by-hour series switches on and
 * off with the roster (a patrol post's swept mask will fit the same way).
 */

/** One piece of the shoreline: the shore between `fromM` and `toM` (chainage), judged at its middle. */
export interface ShoreStation {
  /** Chainage of the piece's start and end, metres (geodesic, from the shoreline's first corner). */
  readonly fromM: number;
  readonly toM: number;
  /** The piece's middle on the shore, grid metres. */
  readonly x: number;
  readonly y: number;
  /** Unit vector square to the shore, pointing out to sea (grid). */
  readonly nx: number;
  readonly ny: number;
}

/** Which side of the line, walking from its start, the sea is on. */
export type SeaSide = 'left' | 'right';

/**
 * Cuts a shoreline into stations of at most `spacingM` (grid length) each:
 * every segment into equal pieces, judged at their middles. Chainage is
 * geodesic: each segment's pieces share its geodesic length `segmentLengthsM[i]`.
 *
 * @param line the shoreline's corners in grid metres, ≥ 2, repeated corners allowed (skipped)
 * @param segmentLengthsM geodesic length of each segment (line.length − 1 values)
 * @param spacingM longest piece, grid metres (> 0)
 * @param seaSide the side of the sea walking from the start
 */
export function shoreStations(
  line: readonly (readonly [number, number])[],
  segmentLengthsM: readonly number[],
  spacingM: number,
  seaSide: SeaSide,
): ShoreStation[] {
  if (!(spacingM > 0)) throw new RangeError('The station spacing must be positive.');
  const stations: ShoreStation[] = [];
  let chainage = 0;
  for (let i = 0; i + 1 < line.length; i++) {
    const [x0, y0] = line[i]!;
    const [x1, y1] = line[i + 1]!;
    const dx = x1 - x0;
    const dy = y1 - y0;
    const gridLength = Math.hypot(dx, dy);
    const geoLength = segmentLengthsM[i] ?? gridLength;
    if (gridLength === 0) continue;
    const pieces = Math.max(1, Math.ceil(gridLength / spacingM));
    // Left of the walking direction (dx, dy) is (−dy, dx).
    const side = seaSide === 'left' ? 1 : -1;
    const nx = (-dy / gridLength) * side;
    const ny = (dx / gridLength) * side;
    for (let p = 0; p < pieces; p++) {
      const t = (p + 0.5) / pieces;
      stations.push({
        fromM: chainage + (geoLength * p) / pieces,
        toM: chainage + (geoLength * (p + 1)) / pieces,
        x: x0 + dx * t,
        y: y0 + dy * t,
        nx,
        ny,
      });
    }
    chainage += geoLength;
  }
  return stations;
}

/** The cell under a grid point, or −1 off the grid. Row 0 = north. */
export function cellAt(grid: GridSpec, x: number, y: number): number {
  const col = Math.floor((x - grid.xll) / grid.cellSize);
  const row = grid.height - 1 - Math.floor((y - grid.yll) / grid.cellSize);
  if (col < 0 || col >= grid.width || row < 0 || row >= grid.height) return -1;
  return row * grid.width + col;
}

/** Offshore sample distances of a band: every half cell from its inner to its outer edge, both included. */
export function bandSamples(band: { fromM: number; toM: number }, cellSize: number): number[] {
  const step = cellSize / 2;
  const count = Math.max(1, Math.ceil((band.toM - band.fromM) / step));
  return Array.from({ length: count + 1 }, (_, i) => band.fromM + ((band.toM - band.fromM) * i) / count);
}

/**
 * Which stations one post watches in one band: 1 where the post sees the
 * target at every transect sample of the band (`seen[cell]` = 1), else 0.
 *
 * @param seen the post's cells where it sees the target (1/0), row-major, row 0 north
 */
export function watchedStations(
  grid: GridSpec,
  stations: readonly ShoreStation[],
  band: { fromM: number; toM: number },
  seen: Uint8Array,
): Uint8Array {
  const samples = bandSamples(band, grid.cellSize);
  const out = new Uint8Array(stations.length);
  stations.forEach((s, i) => {
    for (const d of samples) {
      const cell = cellAt(grid, s.x + s.nx * d, s.y + s.ny * d);
      if (cell < 0 || seen[cell] !== 1) return;
    }
    out[i] = 1;
  });
  return out;
}

/**
 * The side of a shoreline the sea is on, from a sea mask (1 = sea): the side
 * with more sea cells among points one to five cells out from every station.
 * Null when the mask cannot tell (no sea cells near, or as many each side).
 */
export function seaSideFromMask(
  grid: GridSpec,
  line: readonly (readonly [number, number])[],
  seaMask: Uint8Array,
): SeaSide | null {
  const left = shoreStations(line, [], grid.cellSize, 'left');
  let score = 0;
  for (const s of left) {
    for (let k = 1; k <= 5; k++) {
      const d = k * grid.cellSize;
      const l = cellAt(grid, s.x + s.nx * d, s.y + s.ny * d);
      const r = cellAt(grid, s.x - s.nx * d, s.y - s.ny * d);
      score += (l >= 0 && seaMask[l] === 1 ? 1 : 0) - (r >= 0 && seaMask[r] === 1 ? 1 : 0);
    }
  }
  return score > 0 ? 'left' : score < 0 ? 'right' : null;
}

/** Watched stations of one post as runs of station indexes, [first, last] inclusive. */
export function stationRuns(watched: Uint8Array): [number, number][] {
  const runs: [number, number][] = [];
  let start = -1;
  for (let i = 0; i <= watched.length; i++) {
    const on = i < watched.length && watched[i] === 1;
    if (on && start < 0) start = i;
    if (!on && start >= 0) {
      runs.push([start, i - 1]);
      start = -1;
    }
  }
  return runs;
}

/** The stations a post watches, back from its runs. */
export function stationsFromRuns(runs: readonly (readonly [number, number])[], count: number): Uint8Array {
  const out = new Uint8Array(count);
  for (const [a, b] of runs) out.fill(1, Math.max(0, a), Math.min(count, b + 1));
  return out;
}

/** Length and share of the shore watched. */
export interface ShoreMeasure {
  readonly lengthM: number;
  readonly pct: number;
}

/** Stretches of shore the band is not watched along. */
export interface ShoreGap {
  /** Chainage from–to, metres; equal for a seam. */
  readonly fromM: number;
  readonly toM: number;
  readonly lengthM: number;
  /**
   * `unwatched`: stations nobody watches. `seam`: two posts' strips meet with
   * at most one station (one cell) in common — a gap of length zero at the
   * grid's resolution, with nothing to spare.
   */
  readonly kind: 'unwatched' | 'seam';
  /** Stations the gap spans (first, last); a seam names the station it sits at (or before). */
  readonly firstStation: number;
  readonly lastStation: number;
}

/** The band's figures over the shore from the posts taken (`on[p]`, default all). */
export interface StripFigures {
  readonly shoreLengthM: number;
  readonly watched1: ShoreMeasure;
  readonly watched2: ShoreMeasure;
  readonly gaps: ShoreGap[];
}

const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/**
 * Figures of one band along the shore: the length and share watched by ≥ 1
 * and ≥ 2 posts, and the gaps (runs of unwatched stations, and seams where
 * two posts' strips meet within one station). Source: interval union and
 * complement along a line — common practice, no source.
 *
 * @param perPost each post's watched stations (1/0), all the same length as `stations`
 * @param on which posts count (e.g. those on watch in an hour); default all
 */
export function stripFigures(
  stations: readonly ShoreStation[],
  perPost: readonly Uint8Array[],
  on: readonly boolean[] = perPost.map(() => true),
): StripFigures {
  const n = stations.length;
  const shoreLengthM = n ? stations[n - 1]!.toM - stations[0]!.fromM : 0;
  const posts = perPost.filter((_, p) => on[p]);
  const count = new Uint8Array(n);
  for (const w of posts) for (let i = 0; i < n; i++) count[i]! += w[i]!;
  let one = 0;
  let two = 0;
  for (let i = 0; i < n; i++) {
    const len = stations[i]!.toM - stations[i]!.fromM;
    if (count[i]! >= 1) one += len;
    if (count[i]! >= 2) two += len;
  }
  const share = (len: number) => (shoreLengthM > 0 ? round((100 * len) / shoreLengthM, 2) : 0);
  const shares = (a: number, b: number) => {
    for (const w of posts) if (w[a] === 1 && w[b] === 1) return true;
    return false;
  };
  const gaps: ShoreGap[] = [];
  let i = 0;
  while (i < n) {
    if (count[i] === 0) {
      let j = i;
      while (j + 1 < n && count[j + 1] === 0) j++;
      const fromM = stations[i]!.fromM;
      const toM = stations[j]!.toM;
      gaps.push({ fromM, toM, lengthM: toM - fromM, kind: 'unwatched', firstStation: i, lastStation: j });
      i = j + 1;
      continue;
    }
    // A hand-over inside a watched run: no post on both sides of a boundary, or only one station in common.
    if (i + 1 < n && count[i + 1]! > 0 && !shares(i, i + 1)) {
      const at = stations[i]!.toM;
      gaps.push({ fromM: at, toM: at, lengthM: 0, kind: 'seam', firstStation: i, lastStation: i });
    } else if (i > 0 && i + 1 < n && count[i - 1]! > 0 && count[i + 1]! > 0 && !shares(i - 1, i + 1)) {
      const at = (stations[i]!.fromM + stations[i]!.toM) / 2;
      gaps.push({ fromM: at, toM: at, lengthM: 0, kind: 'seam', firstStation: i, lastStation: i });
    }
    i++;
  }
  return {
    shoreLengthM,
    watched1: { lengthM: one, pct: share(one) },
    watched2: { lengthM: two, pct: share(two) },
    gaps,
  };
}

/** A post as `closeGapWith` weighs it. */
export interface GapCandidate {
  readonly x: number;
  readonly y: number;
  /** Eye height above the water, metres. */
  readonly eyeAboveWaterM: number;
  /** Viewing sector, degrees true clockwise from → to; null = all round. */
  readonly sector: { fromDeg: number; toDeg: number } | null;
  /** Grid convergence at the post, radians (true bearing = grid bearing + γ). */
  readonly gridConvergence: number;
}

/** What it would take one post to close a gap. */
export interface GapCloser {
  readonly postIndex: number;
  /** Grid distance from the post to the gap's middle on the shore, metres. */
  readonly distanceM: number;
  /** Farthest point of the band along the gap from the post, metres. */
  readonly farthestM: number;
  /** Eye height above the water the post would need on the smooth earth, metres; null when height cannot help. */
  readonly neededEyeM: number | null;
  /** How much higher than now, metres (0: height is not what hides it — terrain, or the grid); null when height cannot help. */
  readonly raiseByM: number | null;
  /** Why height cannot help, if so. */
  readonly blockedBy: 'range-limit' | 'sector' | null;
}

const insideTrueSector = (bearingDeg: number, sector: { fromDeg: number; toDeg: number }) => {
  const b = ((bearingDeg % 360) + 360) % 360;
  const span = (((sector.toDeg - sector.fromDeg) % 360) + 360) % 360 || 360;
  const off = (((b - sector.fromDeg) % 360) + 360) % 360;
  return off <= span + 1e-9;
};

/**
 * Eye height (above the water) from which a target of height `targetM` can
 * just be seen at arc distance `distanceM` over a smooth sea: the geographic
 * range D = R'·acos(R'/(R'+h)) + R'·acos(R'/(R'+t)) solved for h, with the
 * effective radius R' = R/(1 − k). 0 when the target's own horizon reaches.
 *
 * Source: The American Practical Navigator (Bowditch, NGA Pub. 9), geographic
 * range as the sum of the observer's and the object's horizon distances; the
 * exact arc is inverted here, h = R'(1/cos(d/R') − 1).
 */
export function eyeHeightForRange(distanceM: number, targetM: number, k: number, earthRadiusM: number): number {
  const r = earthRadiusM / (1 - k);
  const targetHorizon = r * Math.atan2(Math.sqrt(targetM * (2 * r + targetM)), r);
  const left = distanceM - targetHorizon;
  if (left <= 0) return 0;
  return r * (1 / Math.cos(left / r) - 1);
}

/**
 * The post that could close a gap with the least change: among the posts
 * whose range limit and sector allow it, the nearest to the gap's middle; if
 * none can, the nearest with the reason. The height asked is the smooth-earth
 * eye height that puts the band's farthest point along the gap within the
 * geographic range (terrain can hide more: then height alone may not do).
 *
 * @returns null without posts
 */
export function closeGapWith(
  stations: readonly ShoreStation[],
  gap: Pick<ShoreGap, 'firstStation' | 'lastStation'>,
  band: { fromM: number; toM: number },
  posts: readonly GapCandidate[],
  target: { countsFromM: number; rangeLimitM: number | null },
  sphere: { k: number; earthRadiusM: number },
): GapCloser | null {
  const first = stations[gap.firstStation]!;
  const last = stations[gap.lastStation]!;
  const mid = stations[Math.floor((gap.firstStation + gap.lastStation) / 2)]!;
  const out = (s: ShoreStation) => ({ x: s.x + s.nx * band.toM, y: s.y + s.ny * band.toM });
  const farPoints = [out(first), out(mid), out(last), first, last];
  const middle = { x: mid.x + mid.nx * ((band.fromM + band.toM) / 2), y: mid.y + mid.ny * ((band.fromM + band.toM) / 2) };
  const judged = posts.map((p, postIndex): GapCloser => {
    const distanceM = Math.hypot(mid.x - p.x, mid.y - p.y);
    const farthestM = Math.max(...farPoints.map((q) => Math.hypot(q.x - p.x, q.y - p.y)));
    const bearingDeg = (Math.atan2(middle.x - p.x, middle.y - p.y) + p.gridConvergence) * (180 / Math.PI);
    const blockedBy =
      target.rangeLimitM !== null && farthestM > target.rangeLimitM
        ? 'range-limit'
        : p.sector && !insideTrueSector(bearingDeg, p.sector)
          ? 'sector'
          : null;
    if (blockedBy) return { postIndex, distanceM, farthestM, neededEyeM: null, raiseByM: null, blockedBy };
    const neededEyeM = eyeHeightForRange(farthestM, target.countsFromM, sphere.k, sphere.earthRadiusM);
    return { postIndex, distanceM, farthestM, neededEyeM, raiseByM: Math.max(0, neededEyeM - p.eyeAboveWaterM), blockedBy };
  });
  const byDistance = (a: GapCloser, b: GapCloser) => a.distanceM - b.distanceM;
  return judged.filter((j) => j.blockedBy === null).sort(byDistance)[0] ?? judged.sort(byDistance)[0] ?? null;
}

/** A post's watched stations as chainage intervals [from, to], metres (touching stations merged). */
export function watchedIntervals(stations: readonly ShoreStation[], watched: Uint8Array): [number, number][] {
  return stationRuns(watched).map(([a, b]) => [stations[a]!.fromM, stations[b]!.toM]);
}

/**
 * Length and share of the shore watched by ≥ 1 and ≥ 2 of the posts on watch,
 * from each post's watched chainage intervals (a sweep over their ends).
 * Equals `stripFigures` on the stations the intervals came from.
 *
 * Source: interval union and overlap by sorting end points — common practice, no source.
 */
export function intervalShares(
  perPost: readonly (readonly (readonly [number, number])[])[],
  on: readonly boolean[],
  shoreLengthM: number,
): { watched1: ShoreMeasure; watched2: ShoreMeasure } {
  const events: [number, number][] = [];
  perPost.forEach((intervals, p) => {
    if (!on[p]) return;
    for (const [a, b] of intervals) if (b > a) events.push([a, 1], [b, -1]);
  });
  // Ends before starts at one place: touching intervals do not overlap.
  events.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  let depth = 0;
  let last = 0;
  let one = 0;
  let two = 0;
  for (const [at, step] of events) {
    if (depth >= 1) one += at - last;
    if (depth >= 2) two += at - last;
    depth += step;
    last = at;
  }
  const share = (len: number) => (shoreLengthM > 0 ? round((100 * len) / shoreLengthM, 2) : 0);
  return { watched1: { lengthM: one, pct: share(one) }, watched2: { lengthM: two, pct: share(two) } };
}
