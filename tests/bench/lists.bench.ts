/**
 * Latency of the list pages with a large site: 1 000 posts seeded into a new
 * site of the bench database, then the posts list (first page, a full page
 * of 500, a search), the site list and the plan list, each requested
 * repeatedly on loopback. Measurement only.
 */
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import request from 'supertest';
import { createApp } from '@/server/app';
import { createDatabase } from '@/server/data/database';
import { OrganizationModel, PostModel, SiteModel } from '@/server/data/models';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

const POSTS = 1000;

export async function benchLists(databaseUrl: string, seconds = 4) {
  const db = createDatabase(databaseUrl);
  const app = createApp({ db, config: TEST_CONFIG, files: scratchFileStore().files });
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  try {
    const org = (await OrganizationModel.findOne({ where: { slug: 'harrowmere' } }))!;
    const site = await SiteModel.create({
      organizationId: org.id,
      name: `Bench district ${Date.now()}`,
      kind: 'forest-district',
    });
    // An invented grid of hilltops, 1 km apart.
    await PostModel.bulkCreate(
      Array.from({ length: POSTS }, (_, i) => ({
        organizationId: org.id,
        siteId: site.id,
        name: `Hilltop ${String(i + 1).padStart(4, '0')}`,
        kind: 'hilltop' as const,
        location: {
          type: 'Point' as const,
          coordinates: [15 + (i % 40) * 0.014, 51.5 + Math.floor(i / 40) * 0.009] as [number, number],
        },
        groundElevationM: 300 + (i % 17) * 10,
        structureHeightM: 0,
        eyeHeightM: 1.6,
        status: i % 5 === 0 ? ('proposed' as const) : ('existing' as const),
        sectorFromDeg: null,
        sectorToDeg: null,
      })),
    );
    const signIn = await request(app)
      .post('/api/auth/sign-in')
      .send({ email: 'planner@demo.kenning.test', password: DEMO_PASSWORD });
    const cookie = (signIn.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1`;
    const pages = [
      ['posts of a 1 000-post site, first page of 200', `/sites/${site.id}/posts`],
      ['posts, a page of 500', `/sites/${site.id}/posts?pageSize=500`],
      ['posts, page 3 of 50 sorted by newest', `/sites/${site.id}/posts?pageSize=50&page=3&sort=-updatedAt`],
      ['posts, searched by name', `/sites/${site.id}/posts?q=hilltop%2009`],
      ['site list', '/sites'],
      ['plan list', '/plans'],
    ] as const;
    const rows = [];
    for (const [name, path] of pages) {
      const r = await autocannon({ url: base + path, headers: { cookie }, connections: 4, duration: seconds });
      rows.push({
        name,
        value: r.latency.p50,
        unit: 'ms p50',
        detail: `p99 ${r.latency.p99} ms, ${Math.round(r.requests.average)} req/s, ${r.non2xx} non-2xx`,
      });
    }
    await PostModel.destroy({ where: { siteId: site.id }, force: true });
    await site.destroy({ force: true });
    return rows;
  } finally {
    server.close();
    await db.close();
  }
}
