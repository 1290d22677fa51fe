import { DateTime } from 'luxon';
import type { HourlySeries } from '@/shared/schemas/coverage';
import { assignmentsRepository } from '@/server/data/repositories/assignments-repository';
import { AppError } from '@/server/domain/app-error';
import type { Actor } from '../actor';
import type { CoverageRunInputs } from './coverage-inputs';
import { visibleRun } from './manage-coverage';
import { hourlyOf } from './shore-coverage';

/**
 * A finished coast run's band shares hour by hour for a chosen day or week,
 * from the roster as it is now: each band's per-post watched stretches are
 * the run's, and a post counts in an hour when it is on watch the whole hour.
 *
 * @throws AppError 404 for a run the actor cannot read; 409 `run_not_done`;
 *   400 for a case the run does not have or a run without bands
 */
export async function coverageHourly(
  actor: Actor,
  runId: string,
  query: { caseKey: string; date?: string; days: number },
): Promise<HourlySeries & { caseKey: string }> {
  const run = await visibleRun(actor, runId);
  if (run.status !== 'done') throw AppError.conflict('The run has not finished.', 'run_not_done');
  const inputs = run.inputs as CoverageRunInputs;
  const shore = inputs.site.shore;
  const found = run.cases.find((c) => c.key === query.caseKey);
  if (!found) throw AppError.badRequest('No such case in this run.', { caseKey: 'Not a case of this run.' });
  if (!shore || found.bands.length === 0) {
    throw AppError.badRequest('This run has no shore bands.', {
      caseKey: 'The site had no shoreline and bands when this run was computed.',
    });
  }
  const day = query.date
    ? DateTime.fromISO(query.date, { zone: shore.timeZone }).startOf('day')
    : DateTime.now().setZone(shore.timeZone).startOf('day');
  if (!day.isValid) throw AppError.badRequest('The date is not valid.', { date: 'Give a date as YYYY-MM-DD.' });
  const ids = new Set(inputs.posts.map((p) => p.id));
  const watches = await assignmentsRepository.inSite(
    actor.organizationId,
    run.siteId,
    day.toJSDate(),
    day.plus({ days: query.days }).toJSDate(),
  );
  const perBand = found.bands.map((b) => inputs.posts.map((p) => b.posts.find((x) => x.postId === p.id)?.watched ?? []));
  const series = hourlyOf({ lengthM: found.shore?.lengthM ?? 0, shore }, inputs.posts, perBand, {
    date: day.toISODate()!,
    days: query.days,
    readAt: new Date().toISOString(),
    watches: watches
      .filter((w) => ids.has(w.postId))
      .map((w) => ({ postId: w.postId, start: Date.parse(w.startsAt), end: w.endsAt ? Date.parse(w.endsAt) : null })),
  });
  return { caseKey: found.key, ...series };
}
