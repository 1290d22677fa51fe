// Over 300 lines: the plan package is drawn page by page in one pass over the gathered data.
import type { CoverageCase } from '@/shared/schemas/coverage';
import { effectiveResolutionArcmin, type PlanResultRow } from '@/shared/schemas/plan';
import { MEAN_EARTH_RADIUS_M } from '@/shared/physics/constants';
import { formatK } from '@/shared/sightline/format-k';
import { gridConvergence } from '@/shared/terrain/grid-convergence';
import { type MapOverlays, drawMap } from './draw-map';
import { type Extent, extentOf, fitFrame } from './map-frame';
import { CROSS_BEARING_PRINT, POSTS_PER_CELL_PRINT } from './map-picture';
import type { PlanPackageData } from './plan-package-data';
import {
  type Column,
  type ReportDocument,
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
  PRINT_CAUTIONS,
  conditionDerivation,
  formatArea,
  formatDistance,
  formatHeight,
  formatPct,
  formatPosition,
  formatTimeIn,
  printable,
} from './report-text';

const PAPER_NAMES = { A4: 'A4', LETTER: 'US Letter', A5: 'A5' } as const;
const STEP_WORDS: Record<string, string> = {
  prepared: 'Prepared',
  submitted: 'Submitted',
  returned: 'Returned',
  approved: 'Approved',
};

interface FrozenPost {
  id: string;
  name: string;
  kind?: string;
  status?: string;
  location: { latDeg: number; lonDeg: number };
  groundElevationM: number;
  structureHeightM: number;
  eyeHeightM: number;
  sector: { fromDeg: number; toDeg: number } | null;
}

/** The plan package as PDF bytes: cover, assumption sheet, site map, verdict, tables, band, and each case's maps. */
export async function renderPlanPackage(data: PlanPackageData): Promise<Buffer> {
  const { plan, site, revision, snapshot } = data;
  const which = revision ? `version ${plan.version}, revision ${revision.number}` : `version ${plan.version}, draft preview`;
  const r = newReportDocument({
    paper: data.options.paper,
    title: `${plan.title} — plan package (${which})`,
    subject: `Coverage plan for ${site.name}; content sha256 ${data.contentHash}`,
  });
  const posts = snapshot.inputs.posts as unknown as FrozenPost[];
  const tz = site.timeZone;

  cover(r, data, which);
  r.doc.addPage();
  assumptionSheet(r, data, posts);
  r.doc.addPage();
  const extent = siteExtent(data, posts);
  siteMap(r, data, posts, extent);
  r.doc.addPage();
  verdictSection(r, data);
  resultsTable(r, snapshot.results);
  sensitivitySection(r, snapshot.results);
  const cases = snapshot.coverage?.cases ?? [];
  for (const [i, c] of cases.entries()) {
    r.doc.addPage();
    await caseSection(r, data, posts, extent, c, i, cases.length);
  }

  finishPages(r, {
    head: `${plan.title} · ${site.name} · ${which} · ${data.organizationName}`,
    foot: `sha256 ${data.contentHash} · made ${formatTimeIn(data.generatedAt, tz)}`,
    watermark: revision ? (revision.approved ? null : 'NOT APPROVED') : 'DRAFT — NOT APPROVED',
  });
  return documentBytes(r);
}

function cover(r: ReportDocument, data: PlanPackageData, which: string) {
  const { doc } = r;
  const { plan, site, revision } = data;
  const tz = site.timeZone;
  doc.font('bold').fontSize(9).fillColor(MUTED).text('COVERAGE PLAN PACKAGE', r.margin, doc.y, { characterSpacing: 1.2 });
  doc.moveDown(0.3);
  doc.font('bold').fontSize(22).fillColor(INK).text(printable(plan.title), { width: r.width });
  doc
    .font('body')
    .fontSize(12)
    .text(printable(`${site.name} · ${data.organizationName}`), { width: r.width });
  doc.moveDown(0.6);
  keyValues(r, [
    ['Version and revision', revision ? which : `${which} — not a revision: figures as the plan stands now`],
    [
      'Status',
      revision
        ? `${plan.status}${revision.approved ? ' — this revision is approved' : ' — this revision is not approved'}`
        : `${plan.status} — DRAFT, NOT APPROVED`,
    ],
    ...(revision
      ? ([['Submitted', `${formatTimeIn(revision.submittedAt, tz)} by ${revision.submittedBy}`]] as [string, string][])
      : []),
    ['Printed', `${formatTimeIn(data.generatedAt, tz)} (times in the site’s time zone, ${tz})`],
    ['Positions', `${COORDINATE_FORMAT_NAMES[data.options.coordinateFormat]} on WGS 84`],
    ['Verdict', verdictLine(data)],
  ]);

  heading(r, 'Signature chain', 2);
  table(
    r,
    [
      { title: 'Step', weight: 1.1 },
      { title: 'Name', weight: 2 },
      { title: 'Role', weight: 1.1 },
      { title: `Time (${tz})`, weight: 2 },
      { title: 'Revision', weight: 0.8, align: 'right' },
    ],
    data.signatures.map((s) => [
      STEP_WORDS[s.step] ?? s.step,
      s.name,
      s.role,
      formatTimeIn(s.at, tz),
      s.revision === null ? '—' : String(s.revision),
    ]),
    { size: 8.5 },
  );

  heading(r, revision ? 'Content hash of this revision (sha256)' : 'Content hash the plan would be frozen with now (sha256)', 2);
  doc.font('Courier').fontSize(9.5).fillColor(INK).text(data.contentHash, r.margin, doc.y, { width: r.width });
  doc.font('body').fontSize(8).fillColor(MUTED);
  doc.text(
    revision
      ? 'The hash of every input and result frozen in this revision. Kenning recomputed it from the stored content when this file was made, and it matched. To check a printout later, look the hash up in Kenning.'
      : 'A draft has no revision yet: this hash only says which figures this preview shows. It changes whenever the plan or its inputs change.',
    { width: r.width },
  );
  doc.fillColor(INK).moveDown(0.8);
  cautionsBox(r, PRINT_CAUTIONS, 9);
}

function verdictLine(data: PlanPackageData): string {
  const v = data.verdict;
  if (!v.checked) return 'Not checked: no terrain coverage was computed for this plan.';
  if (v.passed) return `Meets its standard in all ${v.caseCount} case${v.caseCount === 1 ? '' : 's'}.`;
  const exception = data.revision?.approved && data.justifications.length > 0 ? ' Approved as an exception.' : '';
  return `Does not meet its standard: fails in ${v.failingCaseCount} of ${v.caseCount} cases.${exception}`;
}

function assumptionSheet(r: ReportDocument, data: PlanPackageData, posts: FrozenPost[]) {
  const { snapshot, terrain } = data;
  const coverage = snapshot.coverage;
  const planInputs = snapshot.inputs.plan;
  heading(r, 'Assumption sheet');
  heading(r, 'Terrain', 2);
  if (terrain) {
    const east = terrain.xllM + terrain.width * terrain.cellSizeM;
    const north = terrain.yllM + terrain.height * terrain.cellSizeM;
    keyValues(r, [
      ['Source file', terrain.originalName],
      ['Coordinate system', terrain.crsLabel],
      ['Cell size', `${terrain.cellSizeM} m (${terrain.width} × ${terrain.height} cells)`],
      [
        'Extent (grid metres)',
        `W ${Math.round(terrain.xllM)}, S ${Math.round(terrain.yllM)}, E ${Math.round(east)}, N ${Math.round(north)} — ` +
          `${formatDistance(east - terrain.xllM)} × ${formatDistance(north - terrain.yllM)}`,
      ],
      ['sha256 of the grid', coverage?.terrainSha256 ?? terrain.sha256],
      ['Elevations', `${formatHeight(terrain.minElevationM)} to ${formatHeight(terrain.maxElevationM)}`],
      [
        'Bare earth or surface model',
        'Not declared with the upload: treat the grid as the uploader’s file says. Trees and buildings count only if the grid holds them.',
      ],
    ]);
  } else {
    keyValues(r, [
      [
        'Terrain',
        coverage
          ? 'None: coverage on a flat datum at sea level (horizon, sectors and visibility only).'
          : 'None: no terrain coverage was computed; results on smooth earth only.',
      ],
    ]);
  }
  heading(r, 'Earth, lookout, standard and model', 2);
  const lookout = planInputs.lookout ?? { resolutionArcmin: 1, magnification: 1 };
  const standard = planInputs.standard;
  const targetNames = new Map((snapshot.inputs.targets as { id: string; name: string }[]).map((t) => [t.id, t.name]));
  keyValues(r, [
    ['Earth radius', `${MEAN_EARTH_RADIUS_M.toLocaleString('en-GB')} m (IUGG mean radius), refraction as k per condition`],
    [
      'Lookout resolution',
      `${lookout.resolutionArcmin}′ unaided, magnification ${lookout.magnification}× — ${effectiveResolutionArcmin(lookout).toFixed(2)}′ in use`,
    ],
    [
      'Standard',
      [
        `at least ${standard.minSeenPct} % of the site seen by at least one post`,
        `each priority zone seen by at least ${standard.priorityMinPosts} post${standard.priorityMinPosts === 1 ? '' : 's'}`,
        standard.crossBearingMinPct === null
          ? null
          : `at least ${standard.crossBearingMinPct} % of each priority zone with good cross-bearings`,
        ...standard.targetRules.map(
          (t) =>
            `${targetNames.get(t.targetId) ?? 'a target'}: ${t.minPct} % of the ${t.area === 'site' ? 'site' : 'priority zones'} by at least ${t.minPosts} post${t.minPosts === 1 ? '' : 's'}`,
        ),
      ]
        .filter(Boolean)
        .join('; ') + '.',
    ],
    ['Detection model', planInputs.detectionModel ?? 'not recorded (older revision)'],
    ...(coverage
      ? ([
          ['Coverage run', `${coverage.runId} (${coverage.datum === 'terrain' ? 'on the terrain' : 'flat datum'})`],
          ['Coverage inputs sha256', coverage.inputsHash],
          [
            'Coverage grid',
            `${coverage.grid.width} × ${coverage.grid.height} cells of ${coverage.grid.cellSizeM} m; ${Object.keys(coverage.layerHashes).length} stored layers, each checked against its frozen sha256`,
          ],
        ] as [string, string][])
      : []),
  ]);

  heading(r, 'Conditions', 2);
  const sets = snapshot.inputs.conditionSets as {
    id: string;
    name: string;
    conditions: Record<string, unknown>[];
    visibilityM: number | null;
    visibilityKind: string;
    seaState?: number | null;
    significantWaveHeightM?: number | null;
    backgroundLighting?: string;
  }[];
  const kOf = (setId: string, index: number) =>
    snapshot.results.find((x) => x.conditionSetId === setId && x.conditionIndex === index)?.result.k ?? null;
  table(
    r,
    [
      { title: 'Set', weight: 1.3 },
      { title: 'k and how it was derived', weight: 3.6 },
      { title: 'Visibility', weight: 1.5 },
      { title: 'Sea', weight: 1.1 },
      { title: 'Lights behind', weight: 0.9 },
    ],
    sets.flatMap((s) =>
      s.conditions.map((c, i) => [
        s.name,
        conditionDerivation(c, kOf(s.id, i)),
        s.visibilityM === null
          ? 'not stated'
          : `${formatDistance(s.visibilityM)} (${s.visibilityKind === 'mor-5pct' ? 'MOR, 5 % contrast' : 'meteorological range, 2 %'})`,
        s.significantWaveHeightM != null
          ? `Hs ${s.significantWaveHeightM} m`
          : s.seaState != null
            ? `sea state ${s.seaState}`
            : 'not stated',
        s.backgroundLighting ?? 'none',
      ]),
    ),
  );

  heading(r, 'Targets', 2);
  const targets = snapshot.inputs.targets as {
    name: string;
    kind: string;
    heightM: number;
    widthM: number;
    requiredVisibleM: number;
    period: string;
    lightIntensityCd?: number | null;
    onWater?: boolean;
  }[];
  table(
    r,
    [
      { title: 'Target', weight: 2 },
      { title: 'Height', weight: 0.9, align: 'right' },
      { title: 'Part that must show', weight: 1, align: 'right' },
      { title: 'Width', weight: 0.8, align: 'right' },
      { title: 'Light', weight: 1, align: 'right' },
      { title: 'Day / night', weight: 0.8 },
      { title: 'On water', weight: 0.7 },
    ],
    targets.map((t) => [
      `${t.name} (${t.kind})`,
      formatHeight(t.heightM),
      formatHeight(t.requiredVisibleM),
      formatHeight(t.widthM),
      t.lightIntensityCd == null ? 'none' : `${t.lightIntensityCd.toLocaleString('en-GB')} cd`,
      t.period,
      t.onWater ? 'yes' : 'no',
    ]),
  );

  heading(r, 'Posts', 2);
  const format = data.options.coordinateFormat;
  table(
    r,
    [
      { title: 'Post', weight: 1.6 },
      { title: `Position (${COORDINATE_FORMAT_NAMES[format]})`, weight: 2.4 },
      { title: 'Ground', weight: 0.9, align: 'right' },
      { title: 'Structure', weight: 0.9, align: 'right' },
      { title: 'Eye', weight: 0.6, align: 'right' },
      { title: 'Sector (true)', weight: 1 },
    ],
    posts.map((p) => [
      `${p.name}${p.status === 'proposed' ? ' (proposed)' : ''}`,
      formatPosition(p.location, format),
      formatHeight(p.groundElevationM),
      formatHeight(p.structureHeightM),
      formatHeight(p.eyeHeightM),
      p.sector ? `${p.sector.fromDeg}° to ${p.sector.toDeg}°` : 'all round',
    ]),
  );

  heading(r, 'How the figures were made', 2);
  for (const line of snapshot.assumptions) paragraph(r, `• ${line}`, { size: 8.5 });
  if (snapshot.inputs.attachments.length > 0) {
    heading(r, 'Files frozen with the revision', 2);
    table(
      r,
      [
        { title: 'File', weight: 2 },
        { title: 'Kind', weight: 0.8 },
        { title: 'sha256', weight: 3.4 },
      ],
      snapshot.inputs.attachments.map((a) => [a.name, `${a.ownerType} ${a.kind}`, a.sha256]),
      { size: 7 },
    );
  }
}

/** The ground every map of the package shows: the site's boundary, zones and posts. */
function siteExtent(data: PlanPackageData, posts: FrozenPost[]): Extent {
  const points = [
    ...(data.site.boundary ?? []),
    ...data.site.priorityZones.flatMap((z) => z.ring),
    ...posts.map((p) => [p.location.lonDeg, p.location.latDeg] as [number, number]),
  ].map(([lonDeg, latDeg]) => data.projection.toGrid({ latDeg, lonDeg }));
  if (points.length === 0 && data.snapshot.coverage) {
    const g = data.snapshot.coverage.grid;
    points.push({ x: g.xllM, y: g.yllM }, { x: g.xllM + g.width * g.cellSizeM, y: g.yllM + g.height * g.cellSizeM });
  }
  return extentOf(points.length > 0 ? points : [{ x: 0, y: 0 }]);
}

function overlaysOf(data: PlanPackageData, posts: FrozenPost[], withSectors: boolean): MapOverlays {
  const { projection } = data;
  const onGrid = (ring: [number, number][]) =>
    ring.map(([lonDeg, latDeg]) => {
      const p = projection.toGrid({ latDeg, lonDeg });
      return [p.x, p.y] as [number, number];
    });
  return {
    boundary: data.site.boundary ? onGrid(data.site.boundary) : null,
    zones: data.site.priorityZones.map((z) => ({ name: z.name, ring: onGrid(z.ring) })),
    posts: posts.map((p) => {
      const at = projection.toGrid(p.location);
      const gamma = gridConvergence(projection, p.location);
      const reach = Math.max(
        0,
        ...data.snapshot.results.filter((x) => x.postId === p.id).map((x) => x.result.detectionRangeM ?? 0),
      );
      const rad = (deg: number) => (deg * Math.PI) / 180 - gamma;
      return {
        name: p.name,
        x: at.x,
        y: at.y,
        sector: withSectors && p.sector ? { fromRad: rad(p.sector.fromDeg), toRad: rad(p.sector.toDeg) } : null,
        reachM: reach > 0 ? reach : null,
      };
    }),
  };
}

function crsLabel(data: PlanPackageData) {
  return data.terrain?.crsLabel ?? data.projection.label;
}

function siteMap(r: ReportDocument, data: PlanPackageData, posts: FrozenPost[], extent: Extent) {
  const { doc } = r;
  heading(r, 'Site map');
  paragraph(
    r,
    'Boundary (solid), priority zones (dashed, named in the table of figures), posts (triangles) and viewing sectors (dotted, to the post’s longest detection range), over the terrain’s relief.',
    { size: 8.5, color: MUTED },
  );
  doc.moveDown(0.3);
  const height = Math.min(r.width * 1.05, r.bottom - doc.y - 60);
  const frame = fitFrame(extent, { x: r.margin + 10, y: doc.y, width: r.width - 10, height });
  const middle = data.projection.toLatLon((extent.west + extent.east) / 2, (extent.south + extent.north) / 2);
  drawMap(r, {
    frame,
    hillshade: data.hillshade,
    overlays: overlaysOf(data, posts, true),
    gridConvergenceRad: gridConvergence(data.projection, middle),
    crsLabel: crsLabel(data),
    paperName: PAPER_NAMES[data.options.paper],
  });
  if (data.site.priorityZones.length > 0) {
    paragraph(r, `Priority zones: ${data.site.priorityZones.map((z) => `${z.name} (weight ${z.weight})`).join('; ')}.`, {
      size: 8.5,
    });
  }
}

function verdictSection(r: ReportDocument, data: PlanPackageData) {
  const { verdict, snapshot } = data;
  heading(r, 'The standard’s verdict');
  paragraph(r, verdictLine(data), { font: 'bold' });
  const cases = snapshot.coverage?.cases ?? [];
  if (verdict.checked) {
    const rows = cases.flatMap((c) =>
      c.check.rules.map((rule) => ({
        passed: rule.passed,
        cells: [
          rule.passed ? 'meets' : 'FAILS',
          `${c.targetName} — ${c.conditionSetName}: ${c.conditionLabel}`,
          rule.text,
          formatPct(rule.actualPct),
          formatPct(rule.minPct),
        ],
      })),
    );
    // Failing rules first, then the rules met, each in the run's order.
    const ordered = [...rows.filter((x) => !x.passed), ...rows.filter((x) => x.passed)];
    const caseOnly = verdict.failing.filter((f) => f.ruleId === 'case');
    table(
      r,
      [
        { title: 'Result', weight: 0.7 },
        { title: 'Case', weight: 2.2 },
        { title: 'Rule', weight: 3 },
        { title: 'Reached', weight: 0.8, align: 'right' },
        { title: 'Asked', weight: 0.8, align: 'right' },
      ],
      [
        ...caseOnly.map((f) => ['FAILS', `${f.targetName} — ${f.conditionSetName}: ${f.conditionLabel}`, f.text, '—', '—']),
        ...ordered.map((x) => x.cells),
      ],
    );
  }
  const note = data.revision?.exceptionNote;
  if (note) {
    heading(r, 'Exception note (planner, frozen with the revision)', 2);
    paragraph(r, note);
  }
  for (const j of data.justifications) {
    heading(r, `Justification for approving as an exception — ${j.reviewer}, ${formatTimeIn(j.at, data.site.timeZone)}`, 2);
    paragraph(r, j.text);
  }
}

/** A section that is one table, under its title and a small note on how to read it. */
function explainedTable(r: ReportDocument, title: string, note: string, columns: Column[], rows: string[][]) {
  heading(r, title);
  paragraph(r, note, { size: 8, color: MUTED });
  r.doc.moveDown(0.2);
  table(r, columns, rows);
}

function resultsTable(r: ReportDocument, results: PlanResultRow[]) {
  explainedTable(
    r,
    'Ranges per post, target and condition (smooth earth)',
    'Height of eye above the result’s datum. Horizon: the eye’s horizon distance. Geographic: eye’s horizon plus the target top’s. Detection: the least of the geographic range and the visibility, angular-size, luminous-range and sea-state limits; “limited by” names it.',
    [
      { title: 'Post', weight: 1.5 },
      { title: 'Target', weight: 1.5 },
      { title: 'Condition', weight: 1.8 },
      { title: 'Eye', weight: 0.7, align: 'right' },
      { title: 'Horizon', weight: 0.8, align: 'right' },
      { title: 'Geographic', weight: 0.9, align: 'right' },
      { title: 'Detection', weight: 0.9, align: 'right' },
      { title: 'Limited by', weight: 1 },
    ],
    results.map((x) => [
      x.postName,
      x.targetName,
      `${x.conditionSetName}, k ${formatK(x.result.k)}`,
      formatHeight(x.observerHeightM),
      formatDistance(x.result.horizonDistanceM),
      formatDistance(x.result.geographicRangeM),
      formatDistance(x.result.detectionRangeM),
      x.result.limitedBy ? (LIMIT_WORDS[x.result.limitedBy] ?? x.result.limitedBy) : '—',
    ]),
  );
}

function sensitivitySection(r: ReportDocument, results: PlanResultRow[]) {
  const seen = new Set<string>();
  const rows: string[][] = [];
  for (const x of results) {
    const s = x.sensitivity;
    const key = `${x.postId}:${x.targetId}:${x.conditionSetId}`;
    if (!s || seen.has(key)) continue;
    seen.add(key);
    const span = (b: typeof s.detectionRangeM) =>
      b ? `${formatDistance(b.min)} (k ${formatK(b.kAtMin)}) – ${formatDistance(b.max)} (k ${formatK(b.kAtMax)})` : '—';
    rows.push([
      x.postName,
      x.targetName,
      x.conditionSetName,
      `${formatK(Math.min(...s.ks))} … ${formatK(Math.max(...s.ks))}`,
      span(s.detectionRangeM),
      span(s.geographicRangeM),
      s.spreadPct === null ? '—' : formatPct(s.spreadPct),
    ]);
  }
  if (rows.length === 0) return;
  explainedTable(
    r,
    'Refraction sensitivity band',
    'The same question asked again over k from 0 to 0.3 and the set’s own conditions (ducts left out): how far the detection range and the geographic range move with refraction alone.',
    [
      { title: 'Post', weight: 1.4 },
      { title: 'Target', weight: 1.4 },
      { title: 'Set', weight: 1.2 },
      { title: 'k band', weight: 0.8 },
      { title: 'Detection range', weight: 2.2 },
      { title: 'Geographic range', weight: 2.2 },
      { title: 'Spread', weight: 0.7, align: 'right' },
    ],
    rows,
  );
}

async function caseSection(
  r: ReportDocument,
  data: PlanPackageData,
  posts: FrozenPost[],
  extent: Extent,
  c: CoverageCase,
  index: number,
  count: number,
) {
  const { doc } = r;
  heading(r, `Case ${index + 1} of ${count}: ${c.targetName} — ${c.conditionSetName}, ${c.conditionLabel}`);
  const detection = c.detection;
  paragraph(
    r,
    `${c.check.passed ? 'Meets the standard.' : 'Does not meet the standard.'} Target counted at ${formatHeight(c.targetHeightM)}, k ${formatK(c.refractionCoefficient)}.` +
      (detection?.rangeLimitM != null
        ? ` Detection range from any post at most ${formatDistance(detection.rangeLimitM)} (${LIMIT_WORDS[detection.rangeLimitedBy ?? ''] ?? 'range'}).`
        : '') +
      (detection?.decidedBy
        ? ` Most of the area not covered is decided by: ${LIMIT_WORDS[detection.decidedBy] ?? detection.decidedBy}.`
        : ''),
    { size: 8.5 },
  );
  const area = (m: { area: number; pct: number }) => `${formatPct(m.pct)}`;
  table(
    r,
    [
      { title: 'Area', weight: 1.8 },
      { title: 'Size', weight: 1, align: 'right' },
      { title: 'Seen by ≥ 1', weight: 0.9, align: 'right' },
      { title: '≥ 2', weight: 0.7, align: 'right' },
      { title: '≥ 3', weight: 0.7, align: 'right' },
      { title: 'Good crossing', weight: 1, align: 'right' },
      { title: 'No data', weight: 0.8, align: 'right' },
    ],
    [{ name: 'Site', ...c.site }, ...c.zones.map((z) => ({ ...z, name: `${z.name} (weight ${z.weight})` }))].map((a) => [
      a.name,
      formatArea(a.total.area),
      area(a.seenBy1),
      area(a.seenBy2),
      area(a.seenBy3),
      area(a.goodCrossBearing),
      area(a.noData),
    ]),
    { size: 7.5 },
  );
  paragraph(r, `Each post alone: ${c.posts.map((p) => `${p.postName} ${formatPct(p.seenPct)}`).join('; ')} of the site.`, {
    size: 8,
  });

  const middle = data.projection.toLatLon((extent.west + extent.east) / 2, (extent.south + extent.north) / 2);
  const gamma = gridConvergence(data.projection, middle);
  const overlays = overlaysOf(data, posts, false);
  // The two layers side by side, each on a square frame at the same scale.
  const overhead = 70;
  const gap = 14;
  let side = Math.min((r.width - 10 - gap) / 2, r.bottom - doc.y - 12 - overhead);
  if (side < 170) {
    doc.addPage();
    side = Math.min((r.width - 10 - gap) / 2, r.bottom - doc.y - 12 - overhead);
  }
  doc.moveDown(0.4);
  const top = doc.y;
  let below = top;
  const layers = [
    { name: 'posts-per-cell' as const, palette: POSTS_PER_CELL_PRINT, title: 'Posts that see the target' },
    { name: 'cross-bearing' as const, palette: CROSS_BEARING_PRINT, title: 'Cross-bearings' },
  ];
  for (const [i, l] of layers.entries()) {
    const raster = await data.layer(c.key, l.name);
    if (!raster) continue;
    const left = r.margin + 10 + i * (side + gap);
    const frame = fitFrame(extent, { x: left, y: top, width: side, height: side });
    below = Math.max(
      below,
      drawMap(r, {
        frame,
        hillshade: data.hillshade,
        layer: { raster, palette: l.palette },
        // The blind areas, numbered as in the table below, on the posts-per-cell map.
        overlays:
          i === 0 ? { ...overlays, marks: c.blindAreas.map((b, n) => ({ ...pointOf(b), label: String(n + 1) })) } : overlays,
        gridConvergenceRad: gamma,
        crsLabel: crsLabel(data),
        paperName: PAPER_NAMES[data.options.paper],
      }),
    );
  }
  doc.x = r.margin;
  doc.y = below;

  heading(r, 'Blind areas', 2);
  const format = data.options.coordinateFormat;
  paragraph(
    r,
    `${c.blindSummary.count} blind area${c.blindSummary.count === 1 ? '' : 's'} of at least ${formatArea(c.blindSummary.minArea)}, ${formatArea(c.blindSummary.area)} in all; the largest listed with a point inside each (${COORDINATE_FORMAT_NAMES[format]}, WGS 84), numbered as on the posts-per-cell map.`,
    { size: 8.5 },
  );
  if (c.blindAreas.length > 0) {
    table(
      r,
      [
        { title: '# on the map', weight: 0.5, align: 'right' },
        { title: 'Area', weight: 1, align: 'right' },
        { title: 'A point inside', weight: 3 },
      ],
      c.blindAreas.map((b, i) => [String(i + 1), formatArea(b.area), formatPosition(b.interior ?? b.centroid, format)]),
      { size: 8 },
    );
  }
  shoreSection(r, c, format);
  patrolSection(r, c);
}

/**
 * The shore watched band by band (coast sites with a shoreline and bands): the
 * share of the shore each band is watched along, the gaps with what would close
 * them, and the unwatched hours of the day the run was computed.
 */
function shoreSection(r: ReportDocument, c: CoverageCase, format: PlanPackageData['options']['coordinateFormat']) {
  if (!c.shore || c.bands.length === 0) return;
  heading(r, 'The shore, band by band', 2);
  paragraph(
    r,
    `Along ${formatDistance(c.shore.lengthM)} of shoreline (chainage from its start). A post watches a band at a place on the shore when it sees the target at every point of the offshore transect there within the band; the shore is counted in ${c.shore.stations} stretches about one grid cell long.`,
    { size: 8.5 },
  );
  table(
    r,
    [
      { title: 'Band', weight: 1.4 },
      { title: 'Offshore', weight: 1.2 },
      { title: 'Watched by ≥ 1', weight: 1.2, align: 'right' },
      { title: '≥ 2', weight: 1.2, align: 'right' },
    ],
    c.bands.map((b) => [
      b.name,
      `${formatDistance(b.fromM)}–${formatDistance(b.toM)}`,
      `${formatDistance(b.watched1.lengthM)} (${formatPct(b.watched1.pct)})`,
      `${formatDistance(b.watched2.lengthM)} (${formatPct(b.watched2.pct)})`,
    ]),
    { size: 8 },
  );
  const unwatched = c.gaps.filter((g) => g.kind === 'unwatched');
  const seams = c.gaps.length - unwatched.length;
  paragraph(
    r,
    unwatched.length === 0
      ? `No unwatched stretch in any band${seams > 0 ? ` (${seams} place${seams === 1 ? '' : 's'} where two posts' stretches only just meet)` : ''}.`
      : `${unwatched.length} unwatched stretch${unwatched.length === 1 ? '' : 'es'}${seams > 0 ? `, and ${seams} place${seams === 1 ? '' : 's'} where two posts' stretches only just meet` : ''}. The post named could close a stretch; "raise" is the smooth-sea height it would need to gain (an estimate: terrain may hide the water still).`,
    { size: 8.5 },
  );
  if (unwatched.length > 0) {
    table(
      r,
      [
        { title: 'Band', weight: 1 },
        { title: 'Chainage', weight: 1.3 },
        { title: 'Length', weight: 0.7, align: 'right' },
        { title: 'Middle', weight: 2 },
        { title: 'Could be closed by', weight: 1.8 },
      ],
      unwatched.map((g) => [
        g.band,
        `${formatDistance(g.fromM)}–${formatDistance(g.toM)}`,
        formatDistance(g.lengthM),
        formatPosition(g.at, format),
        !g.closer
          ? '—'
          : g.closer.blockedBy
            ? `${g.closer.postName}: not by height (${g.closer.blockedBy === 'sector' ? 'outside its sector' : 'beyond its range'})`
            : g.closer.raiseByM
              ? `${g.closer.postName}, ${formatHeight(g.closer.raiseByM)} higher`
              : `${g.closer.postName} (height is not what hides it)`,
      ]),
      { size: 7.5 },
    );
  }
  if (c.hourly) {
    const hours = c.hourly.unwatchedHours;
    paragraph(
      r,
      hours.length === 0
        ? `Every hour of ${c.hourly.date} (${c.hourly.timeZone}) has some of each band watched, from the roster as read at ${c.hourly.rosterReadAt.slice(0, 16).replace('T', ' ')} UTC.`
        : `Hours of ${c.hourly.date} (${c.hourly.timeZone}) with a band unwatched, from the roster as read at ${c.hourly.rosterReadAt.slice(0, 16).replace('T', ' ')} UTC: ${hours.map((h) => `${h.local.slice(11, 16)} (${h.bands.join(', ')})`).join('; ')}.`,
      { size: 8.5 },
    );
  }
}

/** Each patrol's figures over its cycle, with the model they follow. */
function patrolSection(r: ReportDocument, c: CoverageCase) {
  if (!c.patrols || c.patrols.length === 0) return;
  heading(r, 'Patrols', 2);
  paragraph(
    r,
    'A patrol counts where it detects the target at least once in its cycle. Sweep width W = 2 × the detection range over open water (definite-range law); coverage factor C = W·L/A for the track length L run in one cycle over the judged area A; probability of detection 1 − e^(−C) (random search). Estimates only: detection at sea depends on the sea state, the lookout and the light.',
    { size: 8.5 },
  );
  table(
    r,
    [
      { title: 'Patrol', weight: 1.6 },
      { title: 'Route', weight: 0.8, align: 'right' },
      { title: 'Cycle', weight: 0.7, align: 'right' },
      { title: 'Swept', weight: 1.3, align: 'right' },
      { title: 'Time in view', weight: 0.9, align: 'right' },
      { title: 'POD', weight: 0.6, align: 'right' },
    ],
    c.patrols.map((p) => [
      p.postName,
      formatDistance(p.routeLengthM),
      `${Math.round(p.cycleMinutes)} min`,
      `${formatArea(p.sweptAreaM2)} (${formatPct(p.sweptPct)})`,
      formatPct(p.meanFractionInView * 100),
      p.pod === null ? '—' : formatPct(p.pod * 100),
    ]),
    { size: 8 },
  );
}

/** A point surely inside a blind area (older runs: its centre of mass), grid metres. */
const pointOf = (b: CoverageCase['blindAreas'][number]) => ({ x: (b.interior ?? b.centroid).x, y: (b.interior ?? b.centroid).y });
