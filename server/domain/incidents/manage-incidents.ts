// Over 300 lines: the incident use cases (open, update, report, fix, notify) share one transaction and hash chain.
import type { Sequelize, Transaction } from 'sequelize';
import {
  evaluateFix,
  FixError,
  landmarkOffsetFix,
  modelDeclination,
  trueBearingDeg,
  type ResolvedFixBearing,
} from '@/shared/fixes';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { formatMgrs } from '@/shared/geo/mgrs';
import { DEFAULT_VERTICAL_SIGMA_DEG } from '@/shared/schemas/fix';
import type {
  Incident,
  IncidentCreate,
  IncidentDetail,
  IncidentFix,
  IncidentReport,
  IncidentReportInput,
  IncidentReportResult,
  IncidentStatus,
  IncidentUpdate,
} from '@/shared/schemas/incident';
import { IncidentFixSchema, IncidentReportSchema } from '@/shared/schemas/incident';
import { assignmentsRepository } from '@/server/data/repositories/assignments-repository';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { landmarksRepository } from '@/server/data/repositories/landmarks-repository';
import {
  incidentsRepository,
  type ChainedEntry,
  type IncidentRow,
  type StoredEntry,
} from '@/server/data/repositories/incidents-repository';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import type { IncidentModel } from '@/server/data/models';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import { fixVisibility } from '@/server/domain/fixes/fix-visibility';
import { verticalAngleFix } from '@/server/domain/fixes/vertical-angle-fix';
import type { Mailer } from '@/server/domain/ports/mailer';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { fixReported } from '@/server/mail/templates';
import { checkChain, entryHash, storedForm } from './hash-chain';

export interface IncidentDeps {
  db: Sequelize;
  mailer: Mailer | null;
  /** Absolute URL of an incident's page, for e-mails. */
  incidentUrl: (incidentId: string) => string;
  /** Loaded terrains, for checking whether each post sees a new fix; without it the fix carries no `visibility`. */
  terrainCache?: TerrainCache;
}

const NOT_FOUND = 'That incident';
const STALE = 'Someone else changed this incident since you loaded it. Reload to see their change, then try again.';

/** The entry body of a report, as stored (the report without the log's own fields). */
type ReportBody = Omit<IncidentReport, 'id' | 'seq' | 'reportedBy' | 'recordedAt'>;
/** The entry body of a fix attempt: the fix, or why the bearings give none. */
type FixBody = { fix: IncidentFix } | { problem: string; fromReports: number[] };

/**
 * Appends one entry to the locked incident's log: the next number, the
 * previous entry's hash, and its own hash over both and its content.
 */
async function appendEntry(
  incident: IncidentModel,
  entry: Pick<ChainedEntry, 'kind' | 'actorId' | 'body'> & { idempotencyKey?: string },
  changes: Parameters<typeof incidentsRepository.append>[2],
  t: Transaction,
): Promise<StoredEntry> {
  const content: ChainedEntry = {
    seq: incident.entryCount + 1,
    kind: entry.kind,
    actorId: entry.actorId,
    recordedAt: new Date(),
    body: storedForm(entry.body),
    prevHash: incident.lastHash,
  };
  return incidentsRepository.append(
    incident,
    { ...content, idempotencyKey: entry.idempotencyKey ?? null, hash: entryHash(content) },
    changes,
    t,
  );
}

function reportOf(entry: StoredEntry): IncidentReport {
  return IncidentReportSchema.parse({
    ...entry.body,
    id: String(entry.seq),
    seq: entry.seq,
    reportedBy: entry.actor,
    recordedAt: entry.recordedAt,
  });
}

/** The latest fix attempt in a log, and the reports. */
function summarise(entries: readonly StoredEntry[]) {
  const reports = entries.filter((e) => e.kind === 'report').map(reportOf);
  const lastFix = entries.filter((e) => e.kind === 'fix').at(-1);
  const body = lastFix?.body as FixBody | undefined;
  const fix = body && 'fix' in body ? IncidentFixSchema.parse(body.fix) : null;
  let fixProblem: string | null = body && 'problem' in body ? body.problem : null;
  const posts = new Set(reports.map((r) => r.postId));
  if (!fix && !fixProblem) {
    fixProblem =
      posts.size === 0
        ? 'No bearings yet. A fix needs bearings from at least two posts.'
        : 'Bearings from one post so far. A fix needs bearings from at least two posts.';
    if (posts.size === 1) fixProblem += ' (Or a vertical angle to the smoke’s base with the bearing.)';
  }
  return { reports, fix, fixProblem };
}

function incidentOf(row: IncidentRow, entries: readonly StoredEntry[]): Incident {
  const { reports, fix } = summarise(entries);
  const { lastHash: _head, ...rest } = row;
  return { ...rest, reportCount: reports.length, fix };
}

/**
 * The fix from the latest bearing of each post that reported (a post's
 * newer bearing replaces its older one: a smoke drifts, a vessel moves).
 */
function fixFrom(
  reports: readonly IncidentReport[],
  posts: Map<string, { latDeg: number; lonDeg: number; eyeHeightM: number }>,
): FixBody | null {
  const latest = new Map<string, IncidentReport>();
  for (const r of reports) latest.set(r.postId, r);
  if (latest.size < 2) return null;
  const used = [...latest.values()].sort((a, b) => a.seq - b.seq);
  const bearings: ResolvedFixBearing[] = used.map((r) => {
    const p = posts.get(r.postId)!;
    return {
      postId: r.postId,
      bearingDeg: r.trueBearingDeg,
      bearingReference: 'true',
      bearingSigmaDeg: r.bearingSigmaDeg,
      ...(r.verticalAngleDeg !== null && { verticalAngleDeg: r.verticalAngleDeg }),
      from: { latDeg: p.latDeg, lonDeg: p.lonDeg },
      postName: r.postName,
      eyeHeightM: p.eyeHeightM,
    };
  });
  const observedAt = used
    .map((r) => r.observedAt)
    .sort()
    .at(-1)!;
  try {
    const result = evaluateFix(observedAt, bearings);
    return {
      fix: {
        ...result.fix,
        fromReports: used.map((r) => r.seq),
        lines: result.reports.map((line, i) => ({
          seq: used[i]!.seq,
          postId: used[i]!.postId,
          postName: used[i]!.postName,
          distanceM: line.distanceM,
          residualDeg: line.residualDeg,
          flagged: line.flagged,
        })),
        computedAt: new Date().toISOString(),
      },
    };
  } catch (error) {
    if (!(error instanceof FixError)) throw error;
    return { problem: `These bearings give no fix: ${error.message}`, fromReports: used.map((r) => r.seq) };
  }
}

/**
 * When the newest report gives the position from a landmark, that places
 * the fix (a stated position beats lines of bearing); a newer bearing
 * without one goes back to the bearings.
 */
function landmarkFix(reports: readonly IncidentReport[]): FixBody | null {
  const last = reports.at(-1);
  const mark = last?.landmark;
  if (!last || !mark) return null;
  const fix = landmarkOffsetFix({
    landmark: { id: mark.landmarkId, name: mark.name, latDeg: mark.latDeg, lonDeg: mark.lonDeg },
    distanceM: mark.distanceM,
    bearingDeg: mark.bearingDeg,
    ...(mark.distanceSigmaM !== null && { distanceSigmaM: mark.distanceSigmaM }),
    ...(mark.bearingSigmaDeg !== null && { bearingSigmaDeg: mark.bearingSigmaDeg }),
  });
  return {
    fix: {
      ...fix,
      fromReports: [last.seq],
      lines: [],
      computedAt: new Date().toISOString(),
    },
  };
}

/**
 * While one post only has reported: the fix from its latest bearing and
 * vertical angle, if it gave one (over the site's terrain, else a smooth
 * earth); null without a vertical angle.
 */
async function onePostFix(
  deps: IncidentDeps,
  actor: Actor,
  siteId: string,
  reports: readonly IncidentReport[],
  posts: Map<string, { latDeg: number; lonDeg: number; eyeHeightM: number }>,
  t: Transaction,
): Promise<FixBody | null> {
  const last = reports.at(-1);
  if (!last || last.verticalAngleDeg === null || new Set(reports.map((r) => r.postId)).size !== 1) return null;
  const p = posts.get(last.postId)!;
  const bearing: ResolvedFixBearing = {
    postId: last.postId,
    bearingDeg: last.trueBearingDeg,
    bearingReference: 'true',
    bearingSigmaDeg: last.bearingSigmaDeg,
    verticalAngleDeg: last.verticalAngleDeg,
    ...(last.verticalAngleSigmaDeg != null && { verticalAngleSigmaDeg: last.verticalAngleSigmaDeg }),
    ...(last.verticalAngleReference != null && { verticalAngleReference: last.verticalAngleReference }),
    from: { latDeg: p.latDeg, lonDeg: p.lonDeg },
    postName: last.postName,
    eyeHeightM: p.eyeHeightM,
  };
  try {
    const result = await verticalAngleFix(
      deps.terrainCache,
      actor.organizationId,
      siteId,
      last.observedAt,
      bearing,
      last.trueBearingDeg,
      t,
    );
    return {
      fix: {
        ...result.fix,
        fromReports: [last.seq],
        lines: [
          {
            seq: last.seq,
            postId: last.postId,
            postName: last.postName,
            distanceM: result.reports[0]!.distanceM,
            residualDeg: 0,
            flagged: false,
          },
        ],
        computedAt: new Date().toISOString(),
      },
    };
  } catch (error) {
    if (!(error instanceof FixError)) throw error;
    return { problem: error.message, fromReports: [last.seq] };
  }
}

/** Observers write only while on a watch at one of the site's posts; reviewers only read. */
async function checkMayWrite(actor: Actor, siteId: string, t?: Transaction) {
  if (actor.role === 'planner' || actor.role === 'admin') return;
  if (
    actor.role === 'observer' &&
    (await assignmentsRepository.onWatchInSite(actor.organizationId, actor.userId, siteId, new Date(), t))
  ) {
    return;
  }
  throw AppError.forbidden(
    actor.role === 'observer'
      ? 'Only observers on a watch at one of this site’s posts, and planners, can write to its incidents.'
      : 'Reviewers read incidents; planners and observers on watch write them.',
  );
}

/** Opens an incident on one of the organisation's sites; the log starts with an "opened" entry. */
export async function openIncident({ db }: IncidentDeps, actor: Actor, input: IncidentCreate): Promise<IncidentDetail> {
  const id = await db.transaction(async (t) => {
    const site = await sitesRepository.findInOrganization(actor.organizationId, input.siteId, t);
    if (!site) throw new AppError(404, 'not_found', 'That site was not found.', { siteId: 'No such site.' });
    await checkMayWrite(actor, site.id, t);
    const incident = await incidentsRepository.create(
      actor.organizationId,
      { siteId: site.id, title: input.title, openedById: actor.userId },
      t,
    );
    await appendEntry(
      incident,
      { kind: 'opened', actorId: actor.userId, body: { title: input.title, siteName: site.name } },
      {},
      t,
    );
    await auditRepository.record(
      actor,
      { action: 'create', entityType: 'incident', entityId: incident.id, after: { title: input.title, siteId: site.id } },
      t,
    );
    return incident.id;
  });
  return incidentDetail(actor, id);
}

export async function listIncidents(actor: Actor, filter: { siteId?: string; status?: IncidentStatus }) {
  const rows = await incidentsRepository.list(actor.organizationId, filter);
  const items = await Promise.all(
    rows.map(async (row) => incidentOf(row, await incidentsRepository.entries(actor.organizationId, row.id))),
  );
  return { items };
}

/** The incident with its reports, its whole log and the check of the log's hash chain. */
export async function incidentDetail(actor: Actor, id: string, t?: Transaction): Promise<IncidentDetail> {
  const row = await incidentsRepository.find(actor.organizationId, id, t);
  if (!row) throw AppError.notFound(NOT_FOUND);
  const entries = await incidentsRepository.entries(actor.organizationId, id, t);
  const chain = checkChain(
    entries.map((e) => ({ ...e, recordedAt: e.recordedAtDate })),
    row.lastHash,
  );
  if (!chain.intact) console.error(`[kenning] INTEGRITY: incident ${id}: ${chain.message}`);
  const { reports, fixProblem } = summarise(entries);
  return {
    incident: incidentOf(row, entries),
    reports,
    entries: entries.map(({ actorId: _a, recordedAtDate: _d, ...e }) => e),
    chain,
    fixProblem,
  };
}

/** A new title, or closing / reopening with a note; each is an entry of the log. */
export async function updateIncident({ db }: IncidentDeps, actor: Actor, id: string, input: IncidentUpdate) {
  await db.transaction(async (t) => {
    const incident = await incidentsRepository.lock(actor.organizationId, id, t);
    if (!incident) throw AppError.notFound(NOT_FOUND);
    await checkMayWrite(actor, incident.siteId, t);
    if (incident.version !== input.version) throw AppError.conflict(STALE, 'stale_version');
    const before = { title: incident.title, status: incident.status };
    if (input.title !== undefined && input.title !== incident.title) {
      await appendEntry(
        incident,
        { kind: 'updated', actorId: actor.userId, body: { title: input.title, previousTitle: incident.title, note: input.note } },
        { title: input.title },
        t,
      );
    }
    if (input.status !== undefined && input.status !== incident.status) {
      const closing = input.status === 'closed';
      await appendEntry(
        incident,
        { kind: closing ? 'closed' : 'reopened', actorId: actor.userId, body: { note: input.note } },
        { status: input.status, closedAt: closing ? new Date() : null },
        t,
      );
    }
    await auditRepository.record(
      actor,
      {
        action: 'update',
        entityType: 'incident',
        entityId: id,
        before,
        after: { title: incident.title, status: incident.status },
      },
      t,
    );
  });
  return incidentDetail(actor, id);
}

/**
 * Stores a bearing from one of the site's posts and, when two or more posts
 * have reported, the incident's new fix — both in the log, in one
 * transaction. The same idempotency key again returns what was stored
 * (nothing new is written); with different content it is a 409. After the
 * write, the organisation's planners are e-mailed the new fix.
 */
export async function addReport(
  deps: IncidentDeps,
  actor: Actor,
  id: string,
  input: IncidentReportInput,
): Promise<IncidentReportResult> {
  const outcome = await deps.db.transaction(async (t) => {
    const incident = await incidentsRepository.lock(actor.organizationId, id, t);
    if (!incident) throw AppError.notFound(NOT_FOUND);
    await checkMayWrite(actor, incident.siteId, t);

    const earlier = await incidentsRepository.entryByKey(id, input.idempotencyKey, t);
    if (earlier) {
      const report = reportOf(earlier);
      if (!sameReport(report, input)) {
        throw new AppError(409, 'idempotency_conflict', 'This report’s key was already used for a different report.', {
          idempotencyKey: 'Already used for a different report. Send a new key for a new report.',
        });
      }
      return { report, replayed: true, newFix: false };
    }
    if (incident.status === 'closed') {
      throw AppError.conflict('This incident is closed. Reopen it to add reports.', 'incident_closed');
    }
    const post = await postsRepository.findInSite(actor.organizationId, incident.siteId, input.postId, t);
    if (!post) {
      throw new AppError(404, 'not_found', 'That post is not one of this site’s posts.', { postId: 'Not a post of this site.' });
    }
    let landmark: ReportBody['landmark'] = null;
    if (input.landmarkOffset) {
      const mark = await landmarksRepository.findInSite(
        actor.organizationId,
        incident.siteId,
        input.landmarkOffset.landmarkId,
        t,
      );
      if (!mark) {
        throw new AppError(404, 'not_found', 'That landmark is not one of this site’s landmarks.', {
          'landmarkOffset.landmarkId': 'Not a landmark of this site.',
        });
      }
      landmark = {
        landmarkId: mark.id,
        name: mark.name,
        latDeg: mark.latDeg,
        lonDeg: mark.lonDeg,
        distanceM: input.landmarkOffset.distanceM,
        bearingDeg: input.landmarkOffset.bearingDeg,
        distanceSigmaM: input.landmarkOffset.distanceSigmaM ?? null,
        bearingSigmaDeg: input.landmarkOffset.bearingSigmaDeg ?? null,
      };
    }
    const when = new Date(input.observedAt);
    const source = input.bearingReference === 'true' ? 'none' : input.declinationDeg === undefined ? 'model' : 'typed';
    const declinationDeg =
      source === 'none'
        ? 0
        : source === 'typed'
          ? input.declinationDeg!
          : modelDeclination(post.location.latDeg, post.location.lonDeg, when).declinationDeg;
    const body: ReportBody = {
      postId: post.id,
      postName: post.name,
      observedAt: when.toISOString(),
      bearingDeg: input.bearingDeg,
      bearingReference: input.bearingReference,
      declinationDeg,
      declinationSource: source,
      trueBearingDeg: trueBearingDeg(input.bearingDeg, input.bearingReference, declinationDeg),
      bearingSigmaDeg: input.bearingSigmaDeg,
      verticalAngleDeg: input.verticalAngleDeg ?? null,
      verticalAngleSigmaDeg:
        input.verticalAngleDeg === undefined ? null : (input.verticalAngleSigmaDeg ?? DEFAULT_VERTICAL_SIGMA_DEG),
      verticalAngleReference: input.verticalAngleDeg === undefined ? null : (input.verticalAngleReference ?? 'horizontal'),
      landmark,
      kind: input.kind,
      note: input.note,
      idempotencyKey: input.idempotencyKey,
    };
    const stored = await appendEntry(
      incident,
      { kind: 'report', actorId: actor.userId, body, idempotencyKey: input.idempotencyKey },
      {},
      t,
    );

    const entries = await incidentsRepository.entries(actor.organizationId, id, t);
    const { reports } = summarise(entries);
    const posts = new Map(
      (await postsRepository.listInSite(actor.organizationId, incident.siteId, t)).map((p) => [
        p.id,
        { ...p.location, eyeHeightM: p.structureHeightM + p.eyeHeightM },
      ]),
    );
    const attempt =
      landmarkFix(reports) ?? fixFrom(reports, posts) ?? (await onePostFix(deps, actor, incident.siteId, reports, posts, t));
    if (attempt && 'fix' in attempt && deps.terrainCache) {
      attempt.fix.visibility = await visibilityOf(deps.terrainCache, actor, incident.siteId, attempt.fix, posts, t);
    }
    if (attempt) await appendEntry(incident, { kind: 'fix', actorId: actor.userId, body: attempt }, {}, t);
    return { report: reportOf(stored), replayed: false, newFix: attempt !== null && 'fix' in attempt };
  });

  const detail = await incidentDetail(actor, id);
  const mailed = outcome.newFix && detail.incident.fix ? await mailFix(deps, actor, detail) : false;
  return { report: outcome.report, fix: detail.incident.fix, fixProblem: detail.fixProblem, replayed: outcome.replayed, mailed };
}

/**
 * Whether each post of the fix sees it; stored with the fix in the log (what
 * was known then). A failure of this check (a terrain file that cannot be
 * read) is logged and leaves the fix without it rather than losing the report.
 */
async function visibilityOf(
  cache: TerrainCache,
  actor: Actor,
  siteId: string,
  fix: IncidentFix,
  posts: Map<string, { latDeg: number; lonDeg: number; eyeHeightM: number }>,
  t: Transaction,
): Promise<IncidentFix['visibility']> {
  try {
    const observers = fix.lines.flatMap((line) => {
      const p = posts.get(line.postId);
      return p
        ? [
            {
              postId: line.postId,
              postName: line.postName,
              siteId,
              location: { latDeg: p.latDeg, lonDeg: p.lonDeg },
              eyeHeightM: p.eyeHeightM,
            },
          ]
        : [];
    });
    return await fixVisibility(cache, actor.organizationId, fix, observers, t);
  } catch (error) {
    console.error('[kenning] fix visibility check failed:', error);
    return undefined;
  }
}

/** Whether a stored report is the one the request describes (same key sent twice). */
function sameReport(stored: IncidentReport, input: IncidentReportInput): boolean {
  return (
    stored.postId === input.postId &&
    Date.parse(stored.observedAt) === Date.parse(input.observedAt) &&
    stored.bearingDeg === input.bearingDeg &&
    stored.bearingReference === input.bearingReference &&
    stored.bearingSigmaDeg === input.bearingSigmaDeg &&
    stored.kind === input.kind
  );
}

/** E-mails the organisation's planners after the write; a failure is logged and reported as `mailed: false`. */
async function mailFix(deps: IncidentDeps, actor: Actor, detail: IncidentDetail): Promise<boolean> {
  const fix = detail.incident.fix!;
  const to = await incidentsRepository.plannerEmails(actor.organizationId);
  if (!deps.mailer || to.length === 0) return false;
  const byPost = new Map(detail.reports.map((r) => [r.seq, r]));
  try {
    await deps.mailer.send({
      to,
      ...fixReported({
        incidentTitle: detail.incident.title,
        siteName: detail.incident.siteName,
        position: `${formatCoordinate(fix, 'ddm')} (WGS 84) · MGRS ${formatMgrs(fix)}`,
        errorArea: `${(fix.errorAreaM2 / 1e6).toFixed(2)} km² — ${fix.errorAreaMethod}`,
        bearings: fix.fromReports.map((seq) => {
          const r = byPost.get(seq)!;
          return `${r.postName}: ${r.trueBearingDeg.toFixed(1)}° true ± ${r.bearingSigmaDeg}° (${r.kind}, ${r.observedAt})`;
        }),
        // What the posts cannot see of the place goes with the warnings: a smoke there may be higher than it looks, or elsewhere.
        warnings: [...fix.warnings, ...(fix.visibility ?? []).filter((v) => v.seesGround === false).map((v) => v.message)],
        incidentUrl: deps.incidentUrl(detail.incident.id),
      }),
    });
    return true;
  } catch (e) {
    console.error('[kenning] fix notification mail failed:', e);
    return false;
  }
}
