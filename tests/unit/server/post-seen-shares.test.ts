import { postSeenShares } from '@/server/domain/coverage/coverage-case';
import type { NetworkPost } from '@/shared/terrain/network-coverage';
import { VISIBILITY_CLASS } from '@/shared/terrain/visibility-classes';
import { gridOf, seededRandom } from '@/tests/unit/terrain/coverage-fixtures';

// Each post's share of the site where it sees the target: cells of class seen or target only within the
// site mask, over the site's cells, in % to 2 decimals (the classes' definitions in visibility-classes.ts).
// Guards the branch-free count; common practice, no source.
describe('postSeenShares', () => {
  const W = 61;
  const H = 37;
  const grid = gridOf(W, H);
  const random = seededRandom(3);
  const classes = [0, 1, 2].map(() => Uint8Array.from({ length: W * H }, () => Math.floor(random() * 5)));
  const network = classes.map((_, p) => ({ post: { col: 10 * p, row: 5, eyeHeight: 10 } }) as unknown as NetworkPost);
  const posts = classes.map((_, p) => ({ id: `p${p}`, name: `Post ${p}` }));

  const expected = (mask: Uint8Array | null) =>
    classes.map((c) => {
      let seen = 0;
      let site = 0;
      for (let i = 0; i < c.length; i++) {
        if (mask !== null && mask[i] !== 1) continue;
        site++;
        if (c[i] === VISIBILITY_CLASS.seen || c[i] === VISIBILITY_CLASS.targetOnly) seen++;
      }
      return Math.round(((100 * seen) / site) * 100) / 100;
    });

  test('without a site mask', () => {
    const shares = postSeenShares(grid, network, classes, null, posts).map((p) => p.seenPct);
    expect(shares).toEqual(expected(null));
    expect(shares.every((s) => s > 20 && s < 60)).toBe(true); // about 2 classes in 5
  });

  test('within a site mask', () => {
    const mask = Uint8Array.from({ length: W * H }, (_, i) => (i % W < 40 && random() < 0.8 ? 1 : 0));
    const shares = postSeenShares(grid, network, classes, mask, posts).map((p) => p.seenPct);
    expect(shares).toEqual(expected(mask));
    expect(shares).not.toEqual(postSeenShares(grid, network, classes, null, posts).map((p) => p.seenPct));
  });
});
