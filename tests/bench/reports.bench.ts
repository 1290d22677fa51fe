/**
 * The printed plan package of the demo's approved forest plan (A4, every
 * page: cover, assumptions, site map, verdict, tables, band, and two maps per
 * coverage case) and one crew card, made through the use cases on the bench
 * database; wall time per file and the process's peak resident memory.
 * Speed figures only; nothing passes or fails.
 */
import { createDatabase } from '@/server/data/database';
import { OrganizationModel, PlanModel, PostModel, UserModel } from '@/server/data/models';
import { crewCard } from '@/server/domain/reports/crew-card';
import { planPackage } from '@/server/domain/reports/plan-package';
import { createDiskFileStore } from '@/server/storage/file-store';
import { type BenchRow } from './measure';

const RUNS = 3;

export async function benchReports(databaseUrl: string, filesDir: string): Promise<BenchRow[]> {
  const db = createDatabase(databaseUrl);
  try {
    const deps = { db, files: createDiskFileStore(filesDir) };
    const org = (await OrganizationModel.findOne({ where: { slug: 'harrowmere' } }))!;
    const reviewer = (await UserModel.findOne({ where: { organizationId: org.id, role: 'reviewer' } }))!;
    const actor = { userId: reviewer.id, organizationId: org.id, role: reviewer.role };
    const plan = (await PlanModel.findOne({ where: { organizationId: org.id, title: 'Fire season cover 2026' } }))!;
    const post = (await PostModel.findOne({ where: { organizationId: org.id, name: 'Crane Knoll Tower' } }))!;

    const rows: BenchRow[] = [];
    const time = async (name: string, make: () => Promise<{ pdf: Buffer }>) => {
      const ms: number[] = [];
      let bytes = 0;
      const cpu = process.cpuUsage();
      for (let i = 0; i < RUNS; i++) {
        const started = performance.now();
        bytes = (await make()).pdf.length;
        ms.push(performance.now() - started);
      }
      const used = process.cpuUsage(cpu);
      const cpuS = (used.user + used.system) / 1e6 / RUNS;
      ms.sort((a, b) => a - b);
      rows.push({
        name,
        value: ms[Math.floor(RUNS / 2)]! / 1000,
        unit: 's',
        detail: `median of ${RUNS}, fastest ${(ms[0]! / 1000).toFixed(2)} s, CPU ${cpuS.toFixed(2)} s each, ${(bytes / 1e6).toFixed(2)} MB`,
      });
    };
    await time('plan package, demo forest plan, A4', () =>
      planPackage(deps, actor, plan.id, 1, { paper: 'A4', coordinateFormat: 'ddm' }),
    );
    await time('plan package, demo forest plan, US Letter, MGRS positions', () =>
      planPackage(deps, actor, plan.id, 1, { paper: 'LETTER', coordinateFormat: 'mgrs' }),
    );
    await time('crew card, Crane Knoll Tower, A5', () =>
      crewCard(deps, actor, post.siteId, post.id, { coordinateFormat: 'utm' }),
    );
    rows.push({
      name: 'peak resident memory of the process (maxRSS)',
      value: process.resourceUsage().maxRSS / 1024,
      unit: 'MB',
      detail: 'whole bench process, database client included',
    });
    return rows;
  } finally {
    await db.close();
  }
}
