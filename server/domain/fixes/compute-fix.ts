import { evaluateFix, FixError, modelDeclination, trueBearingDeg, type ResolvedFixBearing } from '@/shared/fixes';
import type { FixRequest, FixResult } from '@/shared/schemas/fix';
import { postsRepository } from '@/server/data/repositories/posts-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import { fixVisibility, type VisibilityObserver } from './fix-visibility';
import { verticalAngleFix } from './vertical-angle-fix';

/** Where a bearing's declination comes from: typed with it, the magnetic model, or not needed. */
export function declinationSourceOf(b: { bearingReference: 'true' | 'magnetic'; declinationDeg?: number }) {
  if (b.bearingReference === 'true') return 'none' as const;
  return b.declinationDeg === undefined ? ('model' as const) : ('typed' as const);
}

/**
 * A fix from bearings, stored nowhere: each `postId` is looked up in the
 * caller's organisation (its location and eye height), typed observers are
 * taken as given, a magnetic bearing without a declination gets the World
 * Magnetic Model's at its place and time, and the pure core does the rest.
 * One bearing with a vertical angle is fixed on its own: over its post's
 * site's terrain, or a smooth earth for a typed position or a site without.
 *
 * @throws {AppError} 404 `not_found` with `bearings.N.postId` for a post that is not the organisation's;
 *   422 `fix_input` with the bearings at fault when the core cannot fix them (parallel, diverging, …)
 */
export async function computeFix(actor: Actor, request: FixRequest, terrainCache?: TerrainCache): Promise<FixResult> {
  const resolved: ResolvedFixBearing[] = [];
  const sites: (string | null)[] = [];
  for (const [i, bearing] of request.bearings.entries()) {
    if (bearing.postId !== undefined) {
      const post = await postsRepository.findInOrganization(actor.organizationId, bearing.postId);
      if (!post) {
        throw new AppError(404, 'not_found', 'That post was not found.', { [`bearings.${i}.postId`]: 'No such post.' });
      }
      sites.push(post.siteId);
      resolved.push({
        ...bearing,
        from: post.location,
        postName: post.name,
        eyeHeightM: post.structureHeightM + post.eyeHeightM,
      });
    } else {
      const observer = bearing.observer!;
      sites.push(null);
      resolved.push({
        ...bearing,
        from: { latDeg: observer.latDeg, lonDeg: observer.lonDeg },
        postName: null,
        eyeHeightM: observer.eyeHeightM ?? null,
      });
    }
  }
  const when = new Date(request.observedAt);
  const sources = resolved.map((b) => declinationSourceOf(b));
  const withDeclination = resolved.map((b, i) =>
    sources[i] === 'model' ? { ...b, declinationDeg: modelDeclination(b.from.latDeg, b.from.lonDeg, when).declinationDeg } : b,
  );
  try {
    const only = withDeclination[0]!;
    const result =
      withDeclination.length === 1
        ? await verticalAngleFix(
            terrainCache,
            actor.organizationId,
            sites[0] ?? null,
            request.observedAt,
            only,
            trueBearingDeg(only.bearingDeg, only.bearingReference, only.declinationDeg),
          )
        : evaluateFix(request.observedAt, withDeclination);
    const observers: VisibilityObserver[] = resolved.map((b, i) => ({
      postId: b.postId ?? null,
      postName: b.postName,
      siteId: sites[i] ?? null,
      location: b.from,
      eyeHeightM: b.eyeHeightM ?? 0,
    }));
    const visibility = terrainCache ? await fixVisibility(terrainCache, actor.organizationId, result.fix, observers) : undefined;
    return {
      ...result,
      fix: visibility ? { ...result.fix, visibility } : result.fix,
      reports: result.reports.map((r, i) => ({ ...r, declinationSource: sources[i] })),
    };
  } catch (error) {
    if (!(error instanceof FixError)) throw error;
    const indexes = error.bearingIndexes.length > 0 ? error.bearingIndexes : [];
    const fields = Object.fromEntries(indexes.map((i) => [`bearings.${i}.bearingDeg`, error.message]));
    throw new AppError(
      422,
      'fix_input',
      'These bearings do not give a fix.',
      indexes.length ? fields : { bearings: error.message },
    );
  }
}
