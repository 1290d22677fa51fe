import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type request from 'supertest';
import { CrewCardSchema } from '@/shared/schemas/crew-card';
import { PlanHistorySchema, PlanRevisionSchema, type Plan } from '@/shared/schemas/plan';
import { createTestApp } from '@/tests/support/test-db';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { retitleFirstRevision } from '@/tests/support/tamper-revision';

// The printed plan package and crew cards (PDF, pdfkit on the server), parsed back
// with poppler-utils' pdftotext and pdfinfo. Set KENNING_REPORTS_OUT=dir to keep the
// files (and look at them with `pdftoppm -r 50`).

let ctx: Awaited<ReturnType<typeof createTestApp>>;
let reviewer: request.Agent;
let planner: request.Agent;
let observer: request.Agent;
let other: request.Agent;
let work: string;

beforeAll(async () => {
  ctx = await createTestApp();
  reviewer = await signedInAgent(ctx.app, DEMO.reviewer);
  planner = await signedInAgent(ctx.app, DEMO.planner);
  observer = await signedInAgent(ctx.app, DEMO.observer);
  other = await signedInAgent(ctx.app, DEMO.otherPlanner);
  work = mkdtempSync(path.join(os.tmpdir(), 'kenning-reports-'));
});
afterAll(async () => {
  rmSync(work, { recursive: true, force: true });
  await ctx.close();
});

/** supertest gives a PDF body as a Buffer only when told to collect it. */
const binary = (res: request.Response, callback: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

async function pdf(agent: request.Agent, url: string, keepAs?: string) {
  const res = await agent.get(url).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  const body = res.body as Buffer;
  const file = path.join(work, `${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, body);
  if (keepAs && process.env.KENNING_REPORTS_OUT) {
    mkdirSync(process.env.KENNING_REPORTS_OUT, { recursive: true });
    writeFileSync(path.join(process.env.KENNING_REPORTS_OUT, keepAs), body);
  }
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
  return { res, body, text, info };
}

/** "Page size: 595.276 x 841.89 pts (A4)" → [595.276, 841.89]. */
function pageSize(info: string): [number, number] {
  const m = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
  if (!m) throw new Error(`no page size in pdfinfo output:\n${info}`);
  return [Number(m[1]), Number(m[2])];
}
const pages = (info: string) => Number(/Pages:\s+(\d+)/.exec(info)?.[1]);
/** pdftotext keeps the layout's runs of spaces; compare words with single spaces. */
const squeeze = (text: string) => text.replace(/\s+/g, ' ');

async function planTitled(agent: request.Agent, title: string): Promise<Plan> {
  const { body } = await agent.get(`/api/v1/plans?q=${encodeURIComponent(title)}`).expect(200);
  const plan = (body.items as Plan[]).find((p) => p.title === title);
  if (!plan) throw new Error(`demo plan ${title} missing`);
  return plan;
}

describe('GET /plans/:planId/revisions/:n/report.pdf', () => {
  it('prints the approved forest plan with its title, hash, posts, approver and verdict', async () => {
    const plan = await planTitled(reviewer, 'Fire season cover 2026');
    const history = PlanHistorySchema.parse((await reviewer.get(`/api/v1/plans/${plan.id}/revisions`).expect(200)).body);
    const n = history.revisions.at(-1)!.number;
    const revision = PlanRevisionSchema.parse(
      (await reviewer.get(`/api/v1/plans/${plan.id}/revisions/${n}`).expect(200)).body.revision,
    );
    const { res, body, text, info } = await pdf(reviewer, `/api/v1/plans/${plan.id}/revisions/${n}/report.pdf`, 'forest-a4.pdf');

    expect(res.headers['content-type']).toBe('application/pdf');
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // The file name says site, plan, revision and date.
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="?harrowmere-forest-district_fire-season-cover-2026_v1-rev1_\d{4}-\d{2}-\d{2}\.pdf"?$/,
    );

    const flat = squeeze(text);
    expect(flat).toContain('Fire season cover 2026');
    expect(flat).toContain('Harrowmere Forest District');
    expect(flat).toContain('Harrowmere Lookout Service');
    expect(flat).toContain(revision.contentHash);
    for (const post of revision.snapshot.inputs.posts) expect(flat).toContain(String(post.name));
    const approver = history.signatures.find((s) => s.step === 'approved')!.person.name;
    expect(approver).toBe('Lin Okonkwo-Hale');
    expect(flat).toContain(approver);
    expect(flat).toContain(history.signatures.find((s) => s.step === 'prepared')!.person.name);
    // The verdict frozen with the revision, and the recorded exception when it failed.
    const verdict = revision.verdict!;
    expect(verdict.checked).toBe(true);
    if (verdict.passed) expect(flat).toContain(`Meets its standard in all ${verdict.caseCount} cases`);
    else {
      expect(flat).toContain(`Does not meet its standard: fails in ${verdict.failingCaseCount} of ${verdict.caseCount} cases`);
      expect(flat).toContain('FAILS');
      expect(flat).toContain('Justification for approving as an exception');
      expect(flat).toContain(squeeze(revision.exceptionNote!).slice(0, 40));
    }
    // The terrain the coverage was computed on, by its sha256, and every case of the run.
    expect(flat).toContain(revision.snapshot.coverage!.terrainSha256!);
    for (const c of revision.snapshot.coverage!.cases)
      expect(flat).toContain(`${c.targetName} — ${c.conditionSetName}, ${c.conditionLabel}`);
    // The standing cautions.
    expect(flat).toContain('Estimates only');
    expect(flat).toContain('Refraction near the horizon varies widely');
    expect(flat).toContain('Visibility is not detection');
    expect(flat).toContain('Defer to the agency’s procedures, local regulations and licensed practice');
    // Page numbers and the plan and revision on every page.
    const count = pages(info);
    expect(count).toBeGreaterThan(5);
    expect(flat).toContain(`Page ${count} of ${count}`);
    expect(
      text
        .split('\f')
        .filter((p) => squeeze(p).includes('Fire season cover 2026 · Harrowmere Forest District · version 1, revision 1')).length,
    ).toBe(count);
    // An approved revision carries no watermark.
    expect(flat).not.toContain('NOT APPROVED');

    // A4: 210 × 297 mm = 595.28 × 841.89 pt. Source: ISO 216 (A series), 1 pt = 1/72 in = 25.4/72 mm.
    const [w, h] = pageSize(info);
    expect(w).toBeCloseTo(595.28, 0);
    expect(h).toBeCloseTo(841.89, 0);
  });

  it('prints on US Letter when asked, and refuses other paper by field', async () => {
    const plan = await planTitled(reviewer, 'Fire season cover 2026');
    const { info } = await pdf(
      reviewer,
      `/api/v1/plans/${plan.id}/revisions/1/report.pdf?paper=letter&coords=mgrs`,
      'forest-letter.pdf',
    );
    // US Letter: 8.5 × 11 in = 612 × 792 pt. Source: ANSI/ASME Y14.1 size A (Letter), 72 pt to the inch.
    const [w, h] = pageSize(info);
    expect(w).toBeCloseTo(612, 0);
    expect(h).toBeCloseTo(792, 0);

    const bad = await reviewer.get(`/api/v1/plans/${plan.id}/revisions/1/report.pdf?paper=a3`).expect(400);
    expect(bad.body.error.fields).toHaveProperty('paper');
    await reviewer.get(`/api/v1/plans/${plan.id}/revisions/9/report.pdf`).expect(404);
  });

  it('follows the plan’s access: observers once approved, nobody from another organisation', async () => {
    const approved = await planTitled(reviewer, 'Fire season cover 2026');
    const submitted = await planTitled(reviewer, 'Summer watch, Tallow Strand');
    const { text } = await pdf(observer, `/api/v1/plans/${approved.id}/revisions/1/report.pdf`);
    expect(squeeze(text)).toContain('Fire season cover 2026');
    // Observers do not see a plan before it is approved: the same 404 as the plan itself.
    await observer.get(`/api/v1/plans/${submitted.id}`).expect(404);
    await observer.get(`/api/v1/plans/${submitted.id}/revisions/1/report.pdf`).expect(404);
    await observer.get(`/api/v1/plans/${submitted.id}/preview/report.pdf`).expect(404);
    // Another organisation's plan does not exist for the caller.
    await other.get(`/api/v1/plans/${approved.id}/revisions/1/report.pdf`).expect(404);
    await other.get(`/api/v1/plans/${approved.id}/preview/report.pdf`).expect(404);
  });

  it('marks a submitted revision that is not approved', async () => {
    const submitted = await planTitled(reviewer, 'Summer watch, Tallow Strand');
    const { text } = await pdf(reviewer, `/api/v1/plans/${submitted.id}/revisions/1/report.pdf`, 'coast-submitted.pdf');
    const flat = squeeze(text);
    expect(flat).toContain('this revision is not approved');
    expect(flat).toContain('NOT APPROVED');
    for (const name of ['Gull Point', 'Fenwick Head', 'Patrol vessel Kittiwake']) expect(flat).toContain(name);
  });
});

describe('GET /plans/:planId/preview/report.pdf', () => {
  it('prints a draft as it stands, watermarked as not approved', async () => {
    const draft = await planTitled(planner, 'Blackmoss tower proposal');
    expect(draft.status).toBe('draft');
    const { res, text, info } = await pdf(planner, `/api/v1/plans/${draft.id}/preview/report.pdf`, 'draft-preview.pdf');
    expect(res.headers['content-disposition']).toMatch(
      /=harrowmere-forest-district_blackmoss-tower-proposal_v1-draft-preview_\d{4}-\d{2}-\d{2}\.pdf$/,
    );
    const flat = squeeze(text);
    expect(flat).toContain('Blackmoss tower proposal');
    expect(flat).toContain('DRAFT — NOT APPROVED');
    expect(flat).toContain('Content hash the plan would be frozen with now');
    for (const name of ['Crane Knoll Tower', 'Sedge Ridge Tower', 'Blackmoss Tower']) expect(flat).toContain(name);
    expect(pages(info)).toBeGreaterThan(2);
  });
});

describe('GET /sites/:siteId/posts/:postId/card(.pdf)', () => {
  it('gives an observer the crew card of a post from the approved plan, on A5', async () => {
    const approved = await planTitled(observer, 'Fire season cover 2026');
    const posts = (await observer.get(`/api/v1/sites/${approved.siteId}/posts`).expect(200)).body.items as {
      id: string;
      name: string;
    }[];
    const crane = posts.find((p) => p.name === 'Crane Knoll Tower')!;
    const card = CrewCardSchema.parse(
      (await observer.get(`/api/v1/sites/${approved.siteId}/posts/${crane.id}/card`).expect(200)).body.card,
    );
    expect(card.basis).toMatchObject({ kind: 'approved-plan', planTitle: 'Fire season cover 2026', revision: 1 });
    const revision = PlanRevisionSchema.parse(
      (await observer.get(`/api/v1/plans/${approved.id}/revisions/1`).expect(200)).body.revision,
    );
    const frozen = revision.snapshot.results.filter((r) => r.postId === crane.id);
    expect(card.rows.map((r) => r.detectionRangeM)).toEqual(frozen.map((r) => r.result.detectionRangeM));
    // No magnetic model: the card says so rather than guess.
    expect(card.declination).toBeNull();

    const { res, text, info } = await pdf(
      observer,
      `/api/v1/sites/${approved.siteId}/posts/${crane.id}/card.pdf?coords=utm`,
      'crane-card.pdf',
    );
    expect(res.headers['content-disposition']).toMatch(
      /=harrowmere-forest-district_crane-knoll-tower_fire-season-cover-2026-v1-rev1_crew-card_\d{4}-\d{2}-\d{2}\.pdf$/,
    );
    const flat = squeeze(text);
    expect(flat).toContain('Crane Knoll Tower');
    expect(flat).toContain(card.mgrs);
    expect(flat).toContain('Fire season cover 2026');
    expect(flat).toContain(revision.contentHash);
    expect(flat).toContain('Magnetic bearings: not available');
    expect(flat).toContain('Visibility is not detection');
    // A5: 148 × 210 mm = 419.53 × 595.28 pt. Source: ISO 216 (A series), 1 pt = 25.4/72 mm.
    const [w, h] = pageSize(info);
    expect(w).toBeCloseTo(419.53, 0);
    expect(h).toBeCloseTo(595.28, 0);
  });

  it('computes the card of a post no approved plan uses, and says so', async () => {
    const draft = await planTitled(planner, 'Blackmoss tower proposal');
    const posts = (await planner.get(`/api/v1/sites/${draft.siteId}/posts`).expect(200)).body.items as {
      id: string;
      name: string;
    }[];
    const blackmoss = posts.find((p) => p.name === 'Blackmoss Tower')!;
    const card = CrewCardSchema.parse(
      (await planner.get(`/api/v1/sites/${draft.siteId}/posts/${blackmoss.id}/card`).expect(200)).body.card,
    );
    expect(card.basis.kind).toBe('computed');
    expect(card.rows.length).toBeGreaterThan(0);
    const { text } = await pdf(planner, `/api/v1/sites/${draft.siteId}/posts/${blackmoss.id}/card.pdf`, 'blackmoss-card.pdf');
    expect(squeeze(text)).toContain('No approved plan uses this post');
    // Another organisation's post is not found.
    await other.get(`/api/v1/sites/${draft.siteId}/posts/${blackmoss.id}/card.pdf`).expect(404);
  });
});

// Last: it changes the approved demo revision the tests above print.
describe('a revision changed after it was frozen', () => {
  it('is withheld, not printed', async () => {
    const approved = await planTitled(reviewer, 'Fire season cover 2026');
    await retitleFirstRevision(ctx.db, approved.id);
    const errors = jest.spyOn(console, 'error').mockImplementation(() => {});
    try {
      const res = await reviewer.get(`/api/v1/plans/${approved.id}/revisions/1/report.pdf`);
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('revision_tampered');
      const card = await observer.get(`/api/v1/sites/${approved.siteId}/posts/${approved.postIds[0]}/card.pdf`);
      expect(card.status).toBe(500);
    } finally {
      errors.mockRestore();
    }
  });
});
