/**
 * Whether the signed-in person has already been taken to their first screen
 * in this tab. Observers land on their watch and briefing once after signing
 * in (or opening Kenning); after that the Sites item shows the site list.
 */
let landed = false;

/** True until `markLanded` is called (again after `resetLanding`). */
export const isFirstLanding = () => !landed;

export function markLanded() {
  landed = true;
}

/** Called on sign-in and sign-out: the next person lands afresh. */
export function resetLanding() {
  landed = false;
}
