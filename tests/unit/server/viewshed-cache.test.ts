import { cachingViewsheds } from '@/server/domain/coverage/viewshed-cache';
import type { ComputeViewsheds, CoverageViewshedJob } from '@/server/domain/coverage/compute-coverage';
import { computeHiddenHeightRaster } from '@/shared/terrain/hidden-height-raster';
import { generateSyntheticTerrain } from '@/shared/terrain/synthetic-terrain';

const terrain = generateSyntheticTerrain({ width: 80, height: 60, seed: 7 });
const job = (col: number, eyeHeight: number, k = 0.13): CoverageViewshedJob => ({
  post: { col, row: 30, eyeHeight },
  conditions: { refractionCoefficient: k, earthRadius: 6_371_008.8 },
});

/** The core on one thread, counting the viewsheds it computes. */
function counting() {
  const computed: CoverageViewshedJob[] = [];
  const inner: ComputeViewsheds = async (t, jobs, onDone) =>
    jobs.map((j) => {
      computed.push(j);
      const raster = computeHiddenHeightRaster(t, j.post, j.conditions);
      onDone();
      return raster;
    });
  return { inner, computed };
}

describe('cachingViewsheds', () => {
  it('computes a viewshed once, answers repeats from memory with the same heights, and reports every job done', async () => {
    const { inner, computed } = counting();
    const cached = cachingViewsheds(inner, 2 ** 24);
    let done = 0;
    const first = await cached(terrain, [job(10, 15), job(40, 15)], () => done++);
    const second = await cached(terrain, [job(40, 15), job(10, 15), job(70, 15)], () => done++);
    expect(computed.map((j) => j.post.col)).toEqual([10, 40, 70]);
    expect(done).toBe(5);
    expect(second[0]).toBe(first[1]);
    expect(second[1]).toBe(first[0]);
    // What it hands back is what the core computes for that job, in the jobs' order.
    expect(second[2]!.hidden).toEqual(computeHiddenHeightRaster(terrain, job(70, 15).post, job(70, 15).conditions).hidden);
  });

  it('tells apart every input a viewshed depends on: eye height, k, range limit and terrain', async () => {
    const { inner, computed } = counting();
    const cached = cachingViewsheds(inner, 2 ** 24);
    const other = generateSyntheticTerrain({ width: 80, height: 60, seed: 8 });
    await cached(terrain, [job(10, 15)], () => {});
    await cached(
      terrain,
      [job(10, 16), job(10, 15, 0), { ...job(10, 15), conditions: { ...job(10, 15).conditions, maxDistance: 500 } }],
      () => {},
    );
    await cached(other, [job(10, 15)], () => {});
    expect(computed).toHaveLength(5);
  });

  it('forgets the least recently used rasters beyond its byte bound', async () => {
    const { inner, computed } = counting();
    const oneRaster = terrain.width * terrain.height * 4;
    const cached = cachingViewsheds(inner, 2 * oneRaster);
    await cached(terrain, [job(10, 15), job(20, 15)], () => {});
    await cached(terrain, [job(10, 15)], () => {}); // 10 is now the most recent
    await cached(terrain, [job(30, 15)], () => {}); // pushes out 20
    expect(cached.held()).toBe(2);
    await cached(terrain, [job(10, 15), job(20, 15)], () => {});
    expect(computed.map((j) => j.post.col)).toEqual([10, 20, 30, 20]);
  });
});
