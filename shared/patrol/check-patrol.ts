import { isPatrolKind, POST_KIND_LABELS, type Post } from '@/shared/schemas/site';
import { routeLegs } from '@/shared/patrol/route-legs';

/** The patrol fields of a post as they will be stored (after a change is applied). */
export type PatrolFields = Pick<Post, 'kind' | 'route' | 'speedMps' | 'cycleMinutes'>;

/** Legs shorter than this are taken for a doubled waypoint, metres. */
export const MIN_LEG_M = 1;

/**
 * Why a post's patrol fields do not fit together, by field (empty when they
 * do): a route only on a vessel or an aircraft; a route needs a speed and a
 * cycle; no leg of (almost) zero length; the cycle at least as long as one run
 * of the route at the speed. Speed and cycle without a route are refused too
 * (they would mean nothing).
 *
 * Source: common practice, no source.
 *
 * @example
 * checkPatrol({ kind: 'tower', route: [a, b], speedMps: 5, cycleMinutes: 60 }); // { route: 'Only a vessel or an aircraft …' }
 */
export function checkPatrol(post: PatrolFields): Record<string, string> {
  const errors: Record<string, string> = {};
  const route = post.route ?? null;
  const speedMps = post.speedMps ?? null;
  const cycleMinutes = post.cycleMinutes ?? null;
  if (route === null) {
    if (speedMps !== null)
      errors.speedMps = 'A speed belongs to a patrol route; draw or type the route first, or clear the speed.';
    if (cycleMinutes !== null)
      errors.cycleMinutes = 'A cycle belongs to a patrol route; draw or type the route first, or clear the cycle.';
    return errors;
  }
  if (!isPatrolKind(post.kind)) {
    errors.route = `Only a vessel or an aircraft patrols a route; this post is a ${POST_KIND_LABELS[post.kind].toLowerCase()}.`;
    return errors;
  }
  if (speedMps === null) errors.speedMps = 'A patrol route needs the speed it is run at.';
  if (cycleMinutes === null) errors.cycleMinutes = 'A patrol route needs the length of its cycle (time on station).';
  const legs = routeLegs(route, speedMps);
  legs.legLengthsM.forEach((lengthM, i) => {
    if (lengthM < MIN_LEG_M) errors[`route.${i + 1}`] = `Waypoint ${i + 2} is on top of waypoint ${i + 1}: a leg needs a length.`;
  });
  if (legs.transitS !== null && cycleMinutes !== null && legs.transitS > cycleMinutes * 60 + 1e-6) {
    errors.cycleMinutes = `One run of the route takes ${Math.ceil(legs.transitS / 60)} min at this speed; the cycle must be at least that long.`;
  }
  return errors;
}
