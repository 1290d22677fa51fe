import type { CoordinateFormat } from '@/shared/geo/types';
import type { CrewCard } from '@/shared/schemas/crew-card';
import type { Post, Site } from '@/shared/schemas/site';
import { formatK } from '@/shared/sightline/format-k';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import type { Actor } from '../actor';
import { drawMap } from './draw-map';
import { fitFrame } from './map-frame';
import { type ReportDeps, mapProjection, readHillshade } from './plan-package';
import {
  INK,
  MUTED,
  cautionsBox,
  documentBytes,
  finishPages,
  heading,
  keyValues,
  newReportDocument,
  paragraph,
  table,
} from './pdf-layout';
import {
  COORDINATE_FORMAT_NAMES,
  LIMIT_WORDS,
  formatDistance,
  formatHeight,
  formatPosition,
  formatTimeIn,
  printable,
} from './report-text';

/** Standard optical refraction, the condition whose ranges the card's rings show when a set has several. */
const RING_K = 0.13;

/** The crew card on A5: who, where, how high, how far, the marks, the cautions; range rings on a small map. */
export async function renderCrewCard(
  deps: ReportDeps,
  actor: Actor,
  input: { card: CrewCard; site: Site; others: Post[] },
  options: { coordinateFormat: CoordinateFormat },
): Promise<Buffer> {
  const { card, site, others } = input;
  const { post } = card;
  const tz = card.site.timeZone;
  const r = newReportDocument({
    paper: 'A5',
    title: `${post.name} — crew card`,
    subject: `Crew card of ${post.name}, ${card.site.name}`,
  });
  const { doc } = r;

  doc.font('bold').fontSize(7.5).fillColor(MUTED).text('CREW CARD', r.margin, doc.y, { characterSpacing: 1.2 });
  doc.font('bold').fontSize(17).fillColor(INK).text(printable(post.name), { width: r.width });
  doc
    .font('body')
    .fontSize(10)
    .text(printable(`${card.site.name}${post.status === 'proposed' ? ' · proposed post' : ''}`));
  doc.moveDown(0.4);
  keyValues(
    r,
    [
      [
        `Position (${COORDINATE_FORMAT_NAMES[options.coordinateFormat]})`,
        `${formatPosition(post.location, options.coordinateFormat)} (WGS 84)`,
      ],
      ['MGRS', card.mgrs],
      ['Ground elevation', formatHeight(post.groundElevationM)],
      ['Structure, eye above platform', `${formatHeight(post.structureHeightM)}, ${formatHeight(post.eyeHeightM)}`],
      ['Height of eye', `${formatHeight(post.heightOfEyeM)} above the ground the ranges are counted from`],
      ['Sector (true)', post.sector ? `${post.sector.fromDeg}° to ${post.sector.toDeg}°` : 'all round'],
    ],
    118,
  );
  doc.moveDown(0.3);
  paragraph(
    r,
    card.basis.kind === 'approved-plan'
      ? `Figures from the approved plan “${card.basis.planTitle}”, version ${card.basis.version}, revision ${card.basis.revision}, approved ${formatTimeIn(card.basis.approvedAt, tz)}; sha256 ${card.basis.contentHash}.`
      : `No approved plan uses this post: figures computed when printed with Kenning’s sightline core on smooth earth, for ${card.basis.scope}. Not reviewed.`,
    {
      size: 7.5,
      color: card.basis.kind === 'approved-plan' ? INK : '#7A3E00',
      font: card.basis.kind === 'approved-plan' ? 'body' : 'bold',
    },
  );

  // Range rings: each target's detection range under standard refraction (or its set's first condition).
  const rings = ringsOf(card);
  if (rings.length > 0) {
    const terrain = await terrainRepository.findActive(actor.organizationId, site.id);
    const hillshade = terrain ? await readHillshade(deps.files, terrain) : null;
    const ll = post.location;
    const projection = mapProjection(null, terrain, { boundary: site.boundary ?? [[ll.lonDeg, ll.latDeg]] });
    const at = projection.toGrid(post.location);
    const reach = Math.max(...rings.map((x) => x.m)) * 1.08;
    const height = Math.min(r.width * 0.85, r.bottom - doc.y - 60);
    doc.moveDown(0.3);
    const frame = fitFrame(
      { west: at.x - reach, east: at.x + reach, south: at.y - reach, north: at.y + reach },
      { x: r.margin + 10, y: doc.y, width: r.width - 10, height },
    );
    const onGrid = (ring: [number, number][]) =>
      ring.map(([lonDeg, latDeg]) => {
        const p = projection.toGrid({ latDeg, lonDeg });
        return [p.x, p.y] as [number, number];
      });
    drawMap(r, {
      frame,
      hillshade,
      overlays: {
        boundary: site.boundary ? onGrid(site.boundary) : null,
        zones: site.priorityZones.map((z) => ({ name: z.name, ring: onGrid(z.ring) })),
        posts: [post, ...others].map((p) => {
          const g = projection.toGrid(p.location);
          return { name: p.name, x: g.x, y: g.y, sector: null, reachM: null };
        }),
        rings: { x: at.x, y: at.y, radii: rings.map((x) => ({ m: x.m, label: x.label })) },
      },
      gridConvergenceRad: gridConvergence(projection, post.location),
      crsLabel: terrain?.crsLabel ?? projection.label,
      paperName: 'A5',
    });
  }

  heading(r, 'How far from here', 2);
  table(
    r,
    [
      { title: 'Target', weight: 1.5 },
      { title: 'Condition', weight: 1.5 },
      { title: 'Horizon', weight: 0.8, align: 'right' },
      { title: 'Geographic', weight: 0.9, align: 'right' },
      { title: 'Detection', weight: 0.9, align: 'right' },
      { title: 'Limit', weight: 0.9 },
    ],
    card.rows.map((x) => [
      x.targetName,
      `${x.conditionSetName}, k ${formatK(x.k)}`,
      formatDistance(x.horizonDistanceM),
      formatDistance(x.geographicRangeM),
      formatDistance(x.detectionRangeM),
      x.limitedBy ? (LIMIT_WORDS[x.limitedBy] ?? x.limitedBy) : '—',
    ]),
    { size: 7 },
  );

  heading(r, 'Marks seen from the post', 2);
  if (card.marks.length === 0) {
    paragraph(r, 'None recorded: add photos of landmarks with the bearing they look along on the post’s page.', {
      size: 7.5,
      color: MUTED,
    });
  } else {
    table(
      r,
      [
        { title: 'Mark', weight: 2.4 },
        { title: 'Bearing (true)', weight: 1, align: 'right' },
        { title: 'Magnetic', weight: 1.2 },
        { title: 'Distance', weight: 1 },
      ],
      card.marks.map((m) => [
        m.name,
        `${m.bearingTrueDeg.toFixed(0).padStart(3, '0')}°`,
        m.bearingMagneticDeg === null ? 'not available' : `${m.bearingMagneticDeg.toFixed(0).padStart(3, '0')}°`,
        m.distanceM === null ? 'not recorded' : formatDistance(m.distanceM),
      ]),
      { size: 7.5 },
    );
  }
  paragraph(
    r,
    card.declination
      ? `Magnetic declination ${card.declination.deg}° (${card.declination.date}).`
      : 'Magnetic bearings: not available — no magnetic declination is known for this post. Use true bearings, or apply the declination from a current chart.',
    { size: 7, color: MUTED },
  );
  doc.moveDown(0.4);
  cautionsBox(r, card.cautions, 7.5);

  finishPages(r, {
    head: `Crew card · ${post.name} · ${card.site.name}`,
    foot:
      card.basis.kind === 'approved-plan'
        ? `${card.basis.planTitle} v${card.basis.version} rev ${card.basis.revision} · printed ${formatTimeIn(card.generatedAt, tz)}`
        : `Computed, no approved plan · printed ${formatTimeIn(card.generatedAt, tz)}`,
  });
  return documentBytes(r);
}

/**
 * One ring per target (at most four rings): its detection range under the k
 * nearest standard refraction; targets with the same range share a ring.
 */
function ringsOf(card: CrewCard): { m: number; label: string }[] {
  const byTarget = new Map<string, CrewCard['rows'][number]>();
  for (const row of card.rows) {
    if (row.detectionRangeM === null || row.detectionRangeM <= 0) continue;
    const best = byTarget.get(row.targetName);
    if (!best || Math.abs(row.k - RING_K) < Math.abs(best.k - RING_K)) byTarget.set(row.targetName, row);
  }
  const rings = new Map<string, { m: number; names: string[] }>();
  for (const row of byTarget.values()) {
    const key = formatDistance(row.detectionRangeM);
    const ring = rings.get(key) ?? { m: row.detectionRangeM!, names: [] };
    ring.names.push(row.targetName);
    rings.set(key, ring);
  }
  return [...rings.entries()]
    .sort((a, b) => a[1].m - b[1].m)
    .slice(0, 4)
    .map(([distance, ring]) => ({ m: ring.m, label: `${ring.names.join(', ')}: ${distance}` }));
}
