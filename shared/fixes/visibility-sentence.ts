/** What the sentence needs of a post's visibility of a fix (see FixVisibility in shared/schemas/fix.ts). */
export interface VisibilityFacts {
  readonly postName: string | null;
  readonly seesGround: boolean | null;
  readonly minSmokeHeightM: number | null;
  readonly basis: 'coverage-run' | 'profile' | 'no-terrain';
}

const metres = (m: number) => `${Math.round(m)} m`;

/**
 * Whether a post can see a fix point, in Kenning's words: "Sedge Ridge
 * Tower sees the ground there", or "… cannot see the ground there; a smoke
 * would have to rise at least 40 m to show above the terrain in between".
 * Heights are rounded up to the next whole unit by `height` (never down: a
 * smoke just short of the figure would not show).
 *
 * @param facts the post's answer
 * @param height writes a height in metres in the reader's unit (default "40 m")
 * @example
 * visibilitySentence({ postName: 'Crane Knoll Tower', seesGround: false, minSmokeHeightM: 38.2, basis: 'profile' });
 * // 'Crane Knoll Tower cannot see the ground there; a smoke would have to rise at least 39 m to show above the terrain in between.'
 */
export function visibilitySentence(facts: VisibilityFacts, height: (m: number) => string = metres): string {
  const who = facts.postName ?? 'The observer';
  const from = facts.basis === 'coverage-run' ? ' (from the latest coverage run)' : '';
  if (facts.basis === 'no-terrain' || facts.seesGround === null) {
    return `${who}: no terrain here to tell whether the place is in view; on smooth earth only the horizon would hide it.`;
  }
  if (facts.seesGround) return `${who} sees the ground there${from}.`;
  if (facts.minSmokeHeightM === null) return `${who} cannot see the ground there${from}.`;
  return (
    `${who} cannot see the ground there; a smoke would have to rise at least ` +
    `${height(Math.ceil(facts.minSmokeHeightM))} to show above the terrain in between${from}.`
  );
}
