// Over 300 lines: mostly invented demo data (organisations, people, sites, posts, libraries, plans), not logic.
import { copyFile, mkdtemp, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import type { Role } from '@/shared/schemas/auth';
import { hashPassword } from '@/server/domain/auth/passwords';
import { fromUtm } from '@/shared/geo/from-utm';
import type { PostInput, SiteInput } from '@/shared/schemas/site';
import type { ConditionSetInput, TargetInput } from '@/shared/schemas/library';
import { ConditionSetModel, OrganizationModel, SiteModel, TargetProfileModel, UserModel } from '@/server/data/models';
import { conditionSetsRepository, targetsRepository } from '@/server/data/repositories/library-repository';
import { createPlan, reviewPlan, submitPlan, submitVerdict, type PlanDeps } from '@/server/domain/plans/manage-plans';
import { failingRuleLine, type StandardVerdict } from '@/shared/plans/standard-verdict';
import { AssignmentModel, PlanModel, PostModel } from '@/server/data/models';
import { assignmentsRepository } from '@/server/data/repositories/assignments-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository } from '@/server/data/repositories/terrain-repository';
import { uploadTerrain } from '@/server/domain/terrain/manage-terrain';
import type { FileStore } from '@/server/storage/file-store';
import { createTerrainCache, type TerrainCache } from '@/server/terrain/terrain-cache';
import { createTerrainIngestRunner } from '@/server/workers/terrain-ingest-runner';
import { DEFAULT_HILLSHADE_MAX_EDGE } from '@/shared/terrain/hillshade-image';
import { requestCoverage } from '@/server/domain/coverage/manage-coverage';
import { inlineCoverageQueue } from '@/server/queue/inline-coverage-queue';
import { createViewshedPool } from '@/server/workers/viewshed-pool';
import { seedSweepWidthExamples } from './sweep-width-examples';
import { seedDemoTraining } from './trainer-demo';
import { seedDemoLandmarks } from './landmarks-demo';

/** The demo terrain (invented, see assets/terrain/README.md), attached to the forest district. */
export const DEMO_TERRAIN_FILE = path.join(__dirname, '..', '..', 'assets', 'terrain', 'demo-forest-district.tif');

/** Invented demo scenario. Every demo account uses this password. */
export const DEMO_PASSWORD = 'kenning-demo';

export const DEMO_ORGANIZATIONS = [
  {
    slug: 'harrowmere',
    name: 'Harrowmere Lookout Service',
    users: [
      { email: 'admin@demo.kenning.test', name: 'Mara Quillon', role: 'admin' },
      { email: 'planner@demo.kenning.test', name: 'Teodor Ashby', role: 'planner' },
      { email: 'reviewer@demo.kenning.test', name: 'Lin Okonkwo-Hale', role: 'reviewer' },
      { email: 'observer@demo.kenning.test', name: 'Sami Rookwood', role: 'observer' },
      { email: 'lookout.marrow@demo.kenning.test', name: 'Ines Marrow', role: 'observer' },
      { email: 'lookout.tolliver@demo.kenning.test', name: 'Bram Tolliver', role: 'observer' },
    ],
  },
  {
    slug: 'tallon-bay',
    name: 'Tallon Bay Coast Watch',
    users: [
      { email: 'admin@tallon.kenning.test', name: 'Orla Brennick', role: 'admin' },
      { email: 'planner@tallon.kenning.test', name: 'Joss Fenwright', role: 'planner' },
      { email: 'reviewer@tallon.kenning.test', name: 'Wren Achterly', role: 'reviewer' },
    ],
  },
] as const satisfies ReadonlyArray<{
  slug: string;
  name: string;
  users: ReadonlyArray<{ email: string; name: string; role: Role }>;
}>;

/** A point of the demo terrain's grid (UTM zone 33N, invented coordinates) as latitude/longitude. */
const utm33 = (easting: number, northing: number) => {
  const p = fromUtm({ zone: 33, hemisphere: 'N', easting, northing });
  return { latDeg: p.latDeg, lonDeg: p.lonDeg };
};
const ring = (corners: [number, number][]) =>
  corners.map(([e, n]) => {
    const p = utm33(e, n);
    return [p.lonDeg, p.latDeg] as [number, number];
  });

/** The invented scenario: a forest district on the demo terrain and a coast stretch. */
export const DEMO_SITES: { site: SiteInput; posts: PostInput[] }[] = [
  {
    site: {
      name: 'Harrowmere Forest District',
      kind: 'forest-district',
      notes: 'Fire season May–September. Smokes are fixed by cross-bearings from two towers.',
      boundary: ring([
        [513_000, 5_732_000],
        [526_000, 5_732_500],
        [525_500, 5_745_000],
        [514_500, 5_744_000],
      ]),
      priorityZones: [
        {
          name: 'Old-growth stand',
          weight: 9,
          ring: ring([
            [517_000, 5_736_000],
            [521_000, 5_736_000],
            [521_000, 5_740_000],
            [517_000, 5_740_000],
          ]),
        },
      ],
      defaultUnits: 'metric',
      timeZone: 'Europe/Berlin',
      seaLevelMaxM: null,
      targetGroundM: null,
      seaArea: null,
      shoreline: null,
      bands: [],
      heightDatum: 'mean-sea-level',
      tide: null,
    },
    posts: [
      {
        name: 'Crane Knoll Tower',
        kind: 'tower',
        location: utm33(516_200, 5_741_300),
        groundElevationM: 578.4, // the demo terrain's ground there (bilinear)
        structureHeightM: 22,
        eyeHeightM: 1.6,
        sector: null,
        status: 'existing',
      },
      {
        name: 'Sedge Ridge Tower',
        kind: 'tower',
        location: utm33(523_400, 5_739_800),
        groundElevationM: 931.2,
        structureHeightM: 18,
        eyeHeightM: 1.6,
        sector: null,
        status: 'existing',
      },
      {
        name: 'Blackmoss Tower',
        kind: 'tower',
        location: utm33(519_600, 5_733_900),
        groundElevationM: 613.0,
        structureHeightM: 30,
        eyeHeightM: 1.6,
        sector: null,
        status: 'proposed',
      },
    ],
  },
  {
    site: {
      name: 'Tallow Strand',
      kind: 'coast-stretch',
      notes: 'Summer watch 08:00–20:00. Bathers, small craft and kayaks.',
      boundary: ring([
        [530_000, 5_750_000],
        [548_000, 5_750_000],
        [548_000, 5_762_000],
        [530_000, 5_762_000],
      ]),
      priorityZones: [],
      defaultUnits: 'nautical',
      timeZone: 'Europe/Berlin',
      seaLevelMaxM: null,
      targetGroundM: null,
      // The shoreline is drawn by the supervisor (the browser test does); heights above mean sea level.
      shoreline: null,
      bands: [],
      heightDatum: 'mean-sea-level',
      tide: null,
      // North of an invented shoreline that runs a little inland of the two shore posts' beaches.
      seaArea: ring([
        [529_000, 5_751_500],
        [536_000, 5_751_600],
        [541_000, 5_751_900],
        [549_000, 5_752_100],
        [549_000, 5_763_000],
        [529_000, 5_763_000],
      ]),
    },
    posts: [
      {
        name: 'Gull Point',
        kind: 'shore-post',
        location: utm33(533_000, 5_751_200),
        groundElevationM: 14,
        structureHeightM: 6,
        eyeHeightM: 1.6,
        sector: { fromDeg: 290, toDeg: 110 },
        status: 'existing',
      },
      {
        name: 'Fenwick Head',
        kind: 'shore-post',
        location: utm33(544_500, 5_751_800),
        groundElevationM: 38,
        structureHeightM: 0,
        eyeHeightM: 1.6,
        sector: { fromDeg: 270, toDeg: 90 },
        status: 'existing',
      },
      {
        name: 'Patrol vessel Kittiwake',
        kind: 'vessel',
        location: utm33(539_000, 5_757_000),
        groundElevationM: 0,
        structureHeightM: 4.5,
        eyeHeightM: 1.6,
        sector: null,
        status: 'existing',
        // An invented run out and back in front of the beaches, 2 × 4 km at 10 kn (≈ 26 min) in an hour's cycle.
        route: [utm33(537_000, 5_755_000), utm33(541_000, 5_755_500), utm33(537_000, 5_755_000)],
        speedMps: (10 * 1852) / 3600,
        cycleMinutes: 60,
      },
    ],
  },
];

/** Seeds the demo sites once per organisation that has none. */
async function seedDemoSites(db: Sequelize): Promise<boolean> {
  const org = await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } });
  if (!org || (await SiteModel.count({ where: { organizationId: org.id }, paranoid: false })) > 0) return false;
  await db.transaction(async (t) => {
    for (const { site, posts } of DEMO_SITES) {
      const created = await sitesRepository.create(org.id, site, t);
      for (const post of posts) await postsRepository.create(org.id, created.id, post, t);
    }
  });
  return true;
}

/**
 * Starting libraries every organisation gets. Sizes are planning values chosen
 * for the demo (invented, not from a standard); agencies edit them to their own.
 */
export const STARTER_TARGETS: TargetInput[] = [
  {
    name: 'Early smoke column',
    kind: 'smoke-column',
    heightM: 60,
    widthM: 8,
    requiredVisibleM: 30,
    period: 'day',
    lightIntensityCd: null,
    onWater: false,
  },
  {
    name: 'Developed smoke column',
    kind: 'smoke-column',
    heightM: 300,
    widthM: 40,
    requiredVisibleM: 50,
    period: 'day',
    lightIntensityCd: null,
    onWater: false,
  },
  {
    name: 'Person in the water (head)',
    kind: 'person-in-water',
    heightM: 0.3,
    widthM: 0.3,
    requiredVisibleM: 0,
    period: 'day',
    lightIntensityCd: null,
    onWater: true,
  },
  {
    name: 'Six-person life raft',
    kind: 'raft',
    heightM: 1.2,
    widthM: 2,
    requiredVisibleM: 0,
    period: 'day',
    lightIntensityCd: null,
    onWater: true,
  },
  {
    name: 'Small open boat',
    kind: 'small-craft',
    heightM: 1.5,
    widthM: 5,
    requiredVisibleM: 0.5,
    period: 'day',
    lightIntensityCd: null,
    onWater: true,
  },
  // 15 000 cd: the least a hand flare must give under the IMO LSA Code (3.2); held about 1 m above the water.
  {
    name: 'Hand flare',
    kind: 'light',
    heightM: 1,
    widthM: 0.05,
    requiredVisibleM: 0,
    period: 'night',
    lightIntensityCd: 15_000,
    onWater: true,
  },
];

const dayDefaults = { seaState: null, significantWaveHeightM: null, backgroundLighting: 'none' } as const;

export const STARTER_CONDITION_SETS: ConditionSetInput[] = [
  {
    name: 'Standard day',
    conditions: [{ preset: 'standard-optical' }],
    visibilityM: 20_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
  },
  {
    name: 'Refraction spread',
    conditions: [{ preset: 'no-refraction' }, { preset: 'standard-optical' }, { preset: 'radio-four-thirds' }],
    visibilityM: 20_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
  },
  {
    name: 'Hot afternoon, haze',
    conditions: [{ preset: 'sub-refraction-heated-ground' }, { preset: 'no-refraction' }],
    visibilityM: 8_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
  },
  {
    name: 'Cold sea, inversion',
    conditions: [{ preset: 'super-refraction-inversion' }, { preset: 'ducting-strong-inversion' }],
    visibilityM: null,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
  },
  {
    name: 'Breezy day, slight sea',
    conditions: [{ preset: 'standard-optical' }],
    visibilityM: 20_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
    seaState: 3,
  },
  {
    name: 'Clear night',
    conditions: [{ preset: 'standard-optical' }],
    visibilityM: 40_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
  },
  {
    name: 'Hazy night, harbour lights',
    conditions: [{ preset: 'standard-optical' }],
    visibilityM: 3_000,
    visibilityKind: 'mor-5pct',
    ...dayDefaults,
    backgroundLighting: 'some',
  },
];

/** Gives every organisation without libraries the starter targets and condition sets. */
async function seedLibraries(db: Sequelize): Promise<boolean> {
  let added = false;
  for (const org of await OrganizationModel.findAll()) {
    const has =
      (await TargetProfileModel.count({ where: { organizationId: org.id }, paranoid: false })) +
      (await ConditionSetModel.count({ where: { organizationId: org.id }, paranoid: false }));
    if (has > 0) continue;
    await db.transaction(async (t) => {
      for (const target of STARTER_TARGETS) await targetsRepository.create(org.id, target, t);
      for (const set of STARTER_CONDITION_SETS) await conditionSetsRepository.create(org.id, set, t);
    });
    added = true;
  }
  return added;
}

/** The first three failing rules in words, for a demo exception note. */
function shortfallLines(verdict: StandardVerdict): string {
  const lines = verdict.failing.slice(0, 3).map((r) => failingRuleLine(r).replace(/\.$/, ''));
  const more = verdict.failing.length - lines.length;
  return lines.join('; ') + (more > 0 ? `; and ${more} more` : '');
}

/**
 * One approved, one submitted and one draft plan, made through the same use
 * cases people use; the approved and submitted ones with their terrain
 * coverage computed before submitting (the draft's is left for the planner).
 */
async function seedDemoPlans(db: Sequelize, files?: FileStore): Promise<boolean> {
  const org = await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } });
  if (!org || (await PlanModel.count({ where: { organizationId: org.id } })) > 0) return false;
  const user = async (email: string) => {
    const u = await UserModel.findOne({ where: { email } });
    if (!u) throw new Error(`demo user ${email} missing`);
    return { userId: u.id, organizationId: org.id, role: u.role };
  };
  const planner = await user('planner@demo.kenning.test');
  const reviewer = await user('reviewer@demo.kenning.test');
  const deps: PlanDeps = { db, mailer: null, planUrl: (id) => `/plans/${id}` };
  const sites = await SiteModel.findAll({ where: { organizationId: org.id } });
  const forest = sites.find((s) => s.kind === 'forest-district');
  const coast = sites.find((s) => s.kind === 'coast-stretch');
  if (!forest || !coast) return false;
  const posts = async (siteId: string, status?: string) =>
    (await postsRepository.listInSite(org.id, siteId)).filter((p) => !status || p.status === status).map((p) => p.id);
  const targets = await targetsRepository.list(org.id);
  const sets = await conditionSetsRepository.list(org.id);
  const t = (name: string) => targets.filter((x) => x.name === name).map((x) => x.id);
  const c = (name: string) => sets.filter((x) => x.name === name).map((x) => x.id);

  const pool = createViewshedPool();
  // Without a file store there is no terrain: every run is on the flat datum and never reads one.
  const cache: TerrainCache = files
    ? createTerrainCache({ files, maxBytes: 256 * 2 ** 20 })
    : {
        loadTerrain: () => Promise.reject(new Error('the seeder has no file store to read terrain from')),
        stats: () => ({ terrains: 0, bytes: 0, maxBytes: 0 }),
        clear: () => undefined,
      };
  const coverage = { db, queue: inlineCoverageQueue({ db, cache, pool }) };
  try {
    const season = await createPlan(deps, planner, {
      siteId: forest.id,
      title: 'Fire season cover 2026',
      postIds: await posts(forest.id, 'existing'),
      targetIds: [...t('Early smoke column'), ...t('Developed smoke column')],
      conditionSetIds: c('Refraction spread'),
      standard: { minSeenPct: 70, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: null },
      lookout: { resolutionArcmin: 1, magnification: 1 },
    });
    await requestCoverage(coverage, planner, season.id);
    // The existing towers do not reach the district's standard on this terrain: the season plan
    // goes through as a recorded exception, with the figures in the note, never as "meets it".
    const seasonVerdict = await submitVerdict(deps, planner, season.id);
    const s1 = await submitPlan(deps, planner, season.id, {
      rowVersion: season.rowVersion,
      ...(!seasonVerdict.passed && {
        exceptionNote:
          `Short of the standard: ${shortfallLines(seasonVerdict)}. These are the towers the district has this ` +
          'season; the Blackmoss tower proposal is being prepared to close the gap. Submitted so the season has an approved plan.',
      }),
    });
    await reviewPlan(deps, reviewer, season.id, {
      decision: 'approve',
      comment: seasonVerdict.passed
        ? 'Meets the district standard.'
        : 'Does not meet the district standard; approved as an exception for this season only.',
      revision: s1.revision,
      ...(!seasonVerdict.passed && {
        justification:
          'For the 2026 season only: no other tower can be staffed before the season opens, and ' +
          'the unseen ground is to be covered by patrols on high-danger days as the district procedures say. ' +
          'To be reviewed again when the Blackmoss tower proposal is decided.',
      }),
    });

    const summer = await createPlan(deps, planner, {
      siteId: coast.id,
      title: 'Summer watch, Tallow Strand',
      postIds: await posts(coast.id),
      targetIds: [...t('Person in the water (head)'), ...t('Six-person life raft'), ...t('Small open boat')],
      conditionSetIds: [...c('Standard day'), ...c('Cold sea, inversion')],
      standard: {
        minSeenPct: 90,
        priorityMinPosts: 1,
        // The person in the water only near the beaches' posts: a head is lost among the waves far out.
        targetRules: t('Person in the water (head)').map((targetId) => ({
          targetId,
          area: 'site' as const,
          minPosts: 1,
          minPct: 10,
        })),
        crossBearingMinPct: null,
      },
      lookout: { resolutionArcmin: 1, magnification: 1 },
    });
    await requestCoverage(coverage, planner, summer.id);
    const summerVerdict = await submitVerdict(deps, planner, summer.id);
    await submitPlan(deps, planner, summer.id, {
      rowVersion: summer.rowVersion,
      ...(!summerVerdict.passed && {
        exceptionNote:
          `Short of the standard: ${shortfallLines(summerVerdict)}. The reviewer is asked to decide whether the ` +
          'strand can be watched with these posts this summer or the plan should come back with another post.',
      }),
    });

    await createPlan(deps, planner, {
      siteId: forest.id,
      title: 'Blackmoss tower proposal',
      postIds: await posts(forest.id),
      targetIds: t('Early smoke column'),
      conditionSetIds: [...c('Refraction spread'), ...c('Hot afternoon, haze')],
      standard: { minSeenPct: 80, priorityMinPosts: 2, targetRules: [], crossBearingMinPct: 50 },
      lookout: { resolutionArcmin: 1, magnification: 1 },
    });
  } finally {
    await pool.close();
  }
  return true;
}

/**
 * Watches from the day of seeding: two lookouts on duty until further notice
 * and one three-day stretch, so the roster shows both cover and gaps.
 */
async function seedDemoWatches(db: Sequelize, now = new Date()): Promise<boolean> {
  const org = await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } });
  if (!org || (await AssignmentModel.count({ where: { organizationId: org.id }, paranoid: false })) > 0) return false;
  const day = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  const at = (days: number, hours: number) => new Date(day + days * 86_400_000 + hours * 3_600_000);
  const watches = [
    {
      email: 'observer@demo.kenning.test',
      post: 'Crane Knoll Tower',
      startsAt: at(-1, 0),
      endsAt: null,
      note: 'Fire season watch.',
    },
    { email: 'lookout.marrow@demo.kenning.test', post: 'Gull Point', startsAt: at(-1, 0), endsAt: null, note: 'Bathing season.' },
    {
      email: 'lookout.tolliver@demo.kenning.test',
      post: 'Sedge Ridge Tower',
      startsAt: at(1, 6),
      endsAt: at(4, 18),
      note: 'Relief cover.',
    },
  ];
  const posts = await PostModel.findAll({ where: { organizationId: org.id } });
  await db.transaction(async (transaction) => {
    for (const w of watches) {
      const user = await UserModel.findOne({ where: { email: w.email }, transaction });
      const post = posts.find((p) => p.name === w.post);
      if (!user || !post) continue;
      await assignmentsRepository.create(
        org.id,
        { postId: post.id, userId: user.id, startsAt: w.startsAt, endsAt: w.endsAt, note: w.note },
        transaction,
      );
    }
  });
  return true;
}

/**
 * Attaches the demo terrain to the forest district through the same use case
 * as an upload (so the hillshade exists), as the demo planner. Idempotent: runs
 * when the district has no active terrain, or when its stored grid is missing
 * from this file store (then the new upload replaces the old row).
 */
async function seedDemoTerrain(db: Sequelize, files: FileStore): Promise<boolean> {
  const org = await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } });
  if (!org) return false;
  const forest = await SiteModel.findOne({ where: { organizationId: org.id, name: DEMO_SITES[0]!.site.name } });
  if (!forest) return false;
  const current = await terrainRepository.findActive(org.id, forest.id);
  const present = async (key: string) =>
    stat(files.localPath(key)).then(
      () => true,
      () => false,
    );
  if (current && (await present(current.storeKey)) && (await present(current.hillshadeKey))) return false;
  const planner = await UserModel.findOne({ where: { organizationId: org.id, role: 'planner' } });
  if (!planner) return false;
  const workDir = await mkdtemp(path.join(os.tmpdir(), 'kenning-seed-'));
  try {
    // The upload use case consumes its input; give it a copy of the asset.
    const copy = path.join(workDir, 'demo-forest-district.tif');
    await copyFile(DEMO_TERRAIN_FILE, copy);
    await uploadTerrain(
      {
        db,
        files,
        ingest: createTerrainIngestRunner(),
        cache: createTerrainCache({ files, maxBytes: 0 }),
        maxCells: 25_000_000,
        hillshadeMaxEdge: DEFAULT_HILLSHADE_MAX_EDGE,
      },
      { userId: planner.id, organizationId: org.id, role: 'planner' },
      forest.id,
      {
        file: { path: copy, originalName: 'demo-forest-district.tif', bytes: (await stat(copy)).size },
        prj: null,
        epsg: null,
        workDir,
      },
    );
  } finally {
    await rm(workDir, { recursive: true, force: true });
  }
  return true;
}

/**
 * Seeds the demo organisations, users, sites, libraries, plans and watches
 * once, and — given a file store — the forest district's terrain; returns
 * false when nothing was added.
 */
export async function seedDemo(db: Sequelize, options: { files?: FileStore } = {}): Promise<boolean> {
  const accounts = await seedDemoAccounts(db);
  const sites = await seedDemoSites(db);
  const libraries = await seedLibraries(db);
  const sweepWidthTables = await seedSweepWidthExamples(db);
  // Terrain first: the plans are submitted with their terrain coverage.
  const terrain = options.files ? await seedDemoTerrain(db, options.files) : false;
  const plans = await seedDemoPlans(db, options.files);
  const watches = await seedDemoWatches(db);
  const training = await seedDemoTraining(db, DEMO_ORGANIZATIONS[0].slug);
  const landmarks = await seedDemoLandmarks(db);
  return accounts || sites || libraries || sweepWidthTables || plans || watches || terrain || training || landmarks;
}

async function seedDemoAccounts(db: Sequelize): Promise<boolean> {
  if (await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } })) return seedMissingDemoUsers(db);
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (transaction) => {
    for (const org of DEMO_ORGANIZATIONS) {
      const row = await OrganizationModel.create({ slug: org.slug, name: org.name }, { transaction });
      for (const u of org.users) {
        await UserModel.create(
          {
            ...u,
            organizationId: row.id,
            passwordHash,
            inviteTokenHash: null,
            inviteExpiresAt: null,
            lastSignInAt: null,
          },
          { transaction },
        );
      }
    }
  });
  return true;
}

/** Demo accounts added to the list after a database was seeded (e.g. the second organisation's reviewer). */
async function seedMissingDemoUsers(db: Sequelize): Promise<boolean> {
  let added = false;
  await db.transaction(async (transaction) => {
    for (const org of DEMO_ORGANIZATIONS) {
      const row = await OrganizationModel.findOne({ where: { slug: org.slug }, transaction });
      if (!row) continue;
      for (const u of org.users) {
        if (await UserModel.findOne({ where: { email: u.email }, paranoid: false, transaction })) continue;
        await UserModel.create(
          {
            ...u,
            organizationId: row.id,
            passwordHash: await hashPassword(DEMO_PASSWORD),
            inviteTokenHash: null,
            inviteExpiresAt: null,
            lastSignInAt: null,
          },
          { transaction },
        );
        added = true;
      }
    }
  });
  return added;
}
