/** Degrees ↔ radians and angle wrapping for the fix core (pure helpers, no units of their own). */

export const RAD_PER_DEG = Math.PI / 180;

/** An angle difference wrapped to −π…π, radians. */
export function wrapPi(angleRad: number): number {
  const a = ((((angleRad + Math.PI) % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)) - Math.PI;
  return a === -Math.PI ? Math.PI : a;
}

/** A bearing wrapped to 0…360°, degrees. */
export function wrap360Deg(angleDeg: number): number {
  const a = ((angleDeg % 360) + 360) % 360;
  return a === 360 ? 0 : a;
}
