import type { CaseBand, CaseGap, CoverageCase, HourlySeries } from '@/shared/schemas/coverage';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import { checkShoreBandRules } from '@/shared/terrain/check-coverage-standard';
import type { GridProjection } from '@/shared/terrain/grid-projection';
import type { GridSpec } from '@/shared/terrain/grid-spec';
import { countPostsPerCell } from '@/shared/terrain/posts-per-cell';
import { coveragePostOf, type NetworkPost } from '@/shared/terrain/network-coverage';
import {
  closeGapWith,
  intervalShares,
  seaSideFromMask,
  shoreStations,
  stripFigures,
  watchedIntervals,
  watchedStations,
  type GapCandidate,
  type SeaSide,
  type ShoreStation,
} from '@/shared/terrain/shore-strips';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { hourlySeries, hoursOfDays, onWatchByHour, type PostWatch } from '@/shared/roster/hourly-watch';
import type { CoverageRunInputs } from './coverage-inputs';

/* Strip coverage of a coast site's shoreline in a coverage run: the shore's stations (once per run), then per case the bands, gaps and hourly series. */

/** The roster the run reads for its hourly series: the watches of the plan's posts over `date`. */
export interface RunRoster {
  /** Local date (YYYY-MM-DD) in the site's time zone. */
  date: string;
  watches: PostWatch[];
  readAt: string;
}

/** The shoreline laid on the run's grid. */
export interface ShoreContext {
  stations: ShoreStation[];
  seaSide: SeaSide;
  lengthM: number;
  shore: NonNullable<CoverageRunInputs['site']['shore']>;
  /** Each post's chainage (nearest station) and distance from it, metres; null for a patrol, which has no one place. */
  postPlaces: ({ chainageM: number; offsetM: number } | null)[];
}

/**
 * The shoreline on the grid: stations one cell long (chainage geodesic on
 * WGS 84), the sea side from the site's sea mask (else from the terrain: the
 * lower side; else the left, walking from the start).
 */
export function shoreContextOf(
  inputs: CoverageRunInputs,
  grid: GridSpec & { heights?: Float32Array },
  projection: GridProjection,
  seaMask: Uint8Array | null,
  postsXY: readonly ({ x: number; y: number } | null)[],
): ShoreContext | null {
  const shore = inputs.site.shore;
  if (!shore) return null;
  const line = shore.shoreline.map(([lonDeg, latDeg]) => {
    const p = projection.toGrid({ latDeg, lonDeg });
    return [p.x, p.y] as [number, number];
  });
  const lengths = shore.shoreline
    .slice(1)
    .map(
      ([lon, lat], i) =>
        geodesicInverse({ latDeg: shore.shoreline[i]![1], lonDeg: shore.shoreline[i]![0] }, { latDeg: lat, lonDeg: lon })
          .distanceM,
    );
  let seaSide = seaMask ? seaSideFromMask(grid, line, seaMask) : null;
  if (!seaSide && grid.heights) {
    // The side with the lower ground a few cells out.
    const probe = shoreStations(line, lengths, grid.cellSize, 'left');
    let left = 0;
    let right = 0;
    for (const s of probe) {
      const d = 3 * grid.cellSize;
      const at = (x: number, y: number) => {
        const col = Math.floor((x - grid.xll) / grid.cellSize);
        const row = grid.height - 1 - Math.floor((y - grid.yll) / grid.cellSize);
        return col >= 0 && col < grid.width && row >= 0 && row < grid.height ? grid.heights![row * grid.width + col]! : NaN;
      };
      const l = at(s.x + s.nx * d, s.y + s.ny * d);
      const r = at(s.x - s.nx * d, s.y - s.ny * d);
      if (l < r) left++;
      else if (r < l) right++;
    }
    seaSide = left > right ? 'left' : right > left ? 'right' : null;
  }
  const side = seaSide ?? 'left';
  const stations = shoreStations(line, lengths, grid.cellSize, side);
  const lengthM = lengths.reduce((a, b) => a + b, 0);
  const postPlaces = postsXY.map((p) => {
    if (p === null) return null;
    let best = { chainageM: 0, offsetM: Infinity };
    for (const s of stations) {
      const d = Math.hypot(s.x - p.x, s.y - p.y);
      if (d < best.offsetM) best = { chainageM: (s.fromM + s.toM) / 2, offsetM: d };
    }
    return best;
  });
  return { stations, seaSide: side, lengthM, shore, postPlaces };
}

const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/** Where one post sees the target (within its sector), 1/0 per cell. */
function seenMaskOf(grid: GridSpec, entry: NetworkPost, classes: Uint8Array): Uint8Array {
  if (!entry.sector) {
    const out = new Uint8Array(classes.length);
    for (let i = 0; i < classes.length; i++) {
      const c = classes[i]!;
      out[i] = c === VISIBILITY_CLASS.seen || c === VISIBILITY_CLASS.targetOnly ? 1 : 0;
    }
    return out;
  }
  const { counts } = countPostsPerCell(grid, [coveragePostOf(entry, classes)]);
  return counts.map((c) => (c > 0 ? 1 : 0));
}

/**
 * One case's shore figures: every band's watched length and share by ≥ 1 and
 * ≥ 2 posts, each post's watched stretches, the gaps with the post that
 * could close them, the hourly series from the roster, and the standard's
 * band rules added to the case's check.
 */
export function shoreFiguresOf(args: {
  context: ShoreContext;
  grid: GridSpec;
  projection: GridProjection;
  network: readonly NetworkPost[];
  postClasses: readonly Uint8Array[];
  posts: readonly { id: string; name: string }[];
  candidates: readonly GapCandidate[];
  target: { countsFromM: number; rangeLimitM: number | null };
  sphere: { k: number; earthRadiusM: number };
  roster: RunRoster | null;
  standard: CoverageRunInputs['standard'];
  check: CoverageCase['check'];
}): Pick<CoverageCase, 'shore' | 'bands' | 'gaps' | 'hourly' | 'check'> {
  const { context, grid, network, posts } = args;
  const { stations } = context;
  const seen = network.map((entry, i) => seenMaskOf(grid, entry, args.postClasses[i]!));
  const bands: CaseBand[] = [];
  const gaps: CaseGap[] = [];
  const perBandIntervals: [number, number][][][] = [];
  for (const band of context.shore.bands) {
    const perPost = seen.map((mask) => watchedStations(grid, stations, band, mask));
    const figures = stripFigures(stations, perPost);
    const intervals = perPost.map((w) => watchedIntervals(stations, w));
    perBandIntervals.push(intervals);
    bands.push({
      name: band.name,
      fromM: band.fromM,
      toM: band.toM,
      watched1: { lengthM: round(figures.watched1.lengthM, 1), pct: figures.watched1.pct },
      watched2: { lengthM: round(figures.watched2.lengthM, 1), pct: figures.watched2.pct },
      posts: posts.map((p, i) => ({
        postId: p.id,
        postName: p.name,
        lengthM: round(
          intervals[i]!.reduce((sum, [a, b]) => sum + b - a, 0),
          1,
        ),
        watched: intervals[i]!.map(([a, b]) => [round(a, 1), round(b, 1)] as [number, number]),
      })),
    });
    for (const gap of figures.gaps.slice(0, 50)) {
      const closer = closeGapWith(stations, gap, band, args.candidates, args.target, args.sphere);
      const mid = stations[Math.floor((gap.firstStation + gap.lastStation) / 2)]!;
      const at = args.projection.toLatLon(mid.x, mid.y);
      gaps.push({
        band: band.name,
        fromM: round(gap.fromM, 1),
        toM: round(gap.toM, 1),
        lengthM: round(gap.lengthM, 1),
        kind: gap.kind,
        at: { latDeg: at.latDeg, lonDeg: at.lonDeg },
        closer: closer && {
          postId: posts[closer.postIndex]!.id,
          postName: posts[closer.postIndex]!.name,
          distanceM: round(closer.distanceM, 0),
          neededEyeM: closer.neededEyeM === null ? null : round(closer.neededEyeM, 1),
          raiseByM: closer.raiseByM === null ? null : round(closer.raiseByM, 1),
          blockedBy: closer.blockedBy,
        },
      });
    }
  }
  const hourly = args.roster ? hourlyOf(context, posts, perBandIntervals, args.roster) : null;
  const bandRules = args.standard.bandRules ?? [];
  const ruleChecks = checkShoreBandRules(bandRules, bands, hourly);
  const check = ruleChecks.length
    ? {
        ...args.check,
        passed: args.check.passed && ruleChecks.every((r) => r.passed),
        rules: [...args.check.rules, ...ruleChecks],
        reasons: [
          ...ruleChecks.filter((r) => !r.passed).flatMap((r) => r.reasons),
          ...args.check.reasons,
          ...ruleChecks.filter((r) => r.passed).flatMap((r) => r.reasons),
        ],
      }
    : args.check;
  return {
    shore: {
      lengthM: round(context.lengthM, 1),
      stations: stations.length,
      seaSide: context.seaSide,
      // The posts that stand somewhere (patrols move: they have no column on the strip).
      posts: posts.flatMap((p, i) => {
        const place = context.postPlaces[i];
        return place
          ? [{ postId: p.id, postName: p.name, chainageM: round(place.chainageM, 1), offsetM: round(place.offsetM, 1) }]
          : [];
      }),
    },
    bands,
    gaps,
    hourly,
    check,
  };
}

/** The hourly series of one case from each band's per-post watched stretches and the roster. */
export function hourlyOf(
  context: Pick<ShoreContext, 'lengthM' | 'shore'>,
  posts: readonly { id: string }[],
  perBandIntervals: readonly (readonly (readonly [number, number])[])[][],
  roster: RunRoster & { days?: number },
): HourlySeries {
  const days = roster.days ?? 1;
  const hours = hoursOfDays(roster.date, days, context.shore.timeZone);
  const postIds = posts.map((p) => p.id);
  const on = onWatchByHour(roster.watches, postIds, hours);
  const series = hourlySeries(
    hours,
    on,
    postIds,
    context.shore.bands.map((band, b) => ({
      name: band.name,
      shares: (onNow: readonly boolean[]) => {
        const s = intervalShares(perBandIntervals[b]!, onNow, context.lengthM);
        return { watched1Pct: s.watched1.pct, watched2Pct: s.watched2.pct };
      },
    })),
  );
  return {
    date: roster.date,
    days,
    timeZone: context.shore.timeZone,
    rosterReadAt: roster.readAt,
    hours: series.hourly,
    unwatchedHours: series.unwatchedHours,
  };
}
