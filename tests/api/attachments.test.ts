import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { parse as parseDisposition } from 'content-disposition';
import { PNG } from 'pngjs';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { DOCUMENT_MAX_BYTES, PHOTO_MAX_BYTES } from '@/shared/schemas/attachment';
import { createApp } from '@/server/app';
import { AttachmentModel, AuditEventModel, PlanModel, PostModel, SiteModel } from '@/server/data/models';
import type { FileStore } from '@/server/storage/file-store';
import { DEMO, signedInAgent } from '@/tests/support/agents';
import { createTestApp, TEST_CONFIG } from '@/tests/support/test-db';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

const fixture = (name: string) => readFileSync(path.join(__dirname, '..', 'fixtures', 'attachments', name));
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** A PNG written by pngjs (an independent encoder) of the given size. */
function pngOf(width: number, height: number, shade = 120): Buffer {
  const png = new PNG({ width, height });
  for (let i = 0; i < png.data.length; i += 4) png.data.set([shade, (i >> 4) & 255, 90, 255], i);
  return PNG.sync.write(png);
}

let app: Express;
let db: Sequelize;
let files: FileStore;
let filesDir: string;
let tempDir: string;
let close: () => Promise<void>;
const agents = {} as Record<keyof typeof DEMO, Agent>;
const owners = {} as Record<
  'post' | 'site' | 'approvedPlan' | 'draftPlan',
  { ownerType: 'post' | 'site' | 'plan'; ownerId: string }
>;

beforeAll(async () => {
  const test = await createTestApp();
  ({ db, files, filesDir } = test);
  tempDir = mkdtempSync(path.join(os.tmpdir(), 'kenning-incoming-'));
  // The same database and store, with a temp folder this file can watch.
  app = createApp({ db, config: TEST_CONFIG, files, uploadTempDir: tempDir });
  close = async () => {
    await test.close();
    await rm(tempDir, { recursive: true, force: true });
  };
  for (const [role, email] of Object.entries(DEMO)) agents[role as keyof typeof DEMO] = await signedInAgent(app, email);
  const [post, site, approved, draft] = await Promise.all([
    PostModel.findOne({ where: { name: 'Crane Knoll Tower' } }),
    SiteModel.findOne({ where: { name: 'Harrowmere Forest District' } }),
    PlanModel.findOne({ where: { title: 'Fire season cover 2026', status: 'approved' } }),
    PlanModel.findOne({ where: { title: 'Blackmoss tower proposal', status: 'draft' } }),
  ]);
  owners.post = { ownerType: 'post', ownerId: post!.id };
  owners.site = { ownerType: 'site', ownerId: site!.id };
  owners.approvedPlan = { ownerType: 'plan', ownerId: approved!.id };
  owners.draftPlan = { ownerType: 'plan', ownerId: draft!.id };
});
afterAll(() => close());

interface FilePart {
  data: Buffer;
  name: string;
  type?: string;
}

/** A multipart upload: text fields first, then the file (the order a browser's FormData keeps). */
function upload(agent: Agent | ReturnType<typeof request>, fields: Record<string, string | number>, file?: FilePart) {
  let req = agent.post('/api/v1/attachments');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  if (file) req = req.attach('file', file.data, { filename: file.name, contentType: file.type ?? 'application/octet-stream' });
  return req;
}

const photoOf = (owner: keyof typeof owners, extra: Record<string, string | number> = {}) => ({
  ...owners[owner],
  kind: 'photo',
  ...extra,
});

async function uploadPhoto(owner: keyof typeof owners = 'post', extra: Record<string, string | number> = {}) {
  // An approved plan takes no new files; its files were attached while it was a draft, as here.
  const reopen = owner === 'approvedPlan';
  if (reopen) await PlanModel.update({ status: 'draft' }, { where: { id: owners.approvedPlan.ownerId } });
  try {
    const res = await upload(agents.planner, photoOf(owner, extra), { data: fixture('ridge-64x48.png'), name: 'ridge.png' });
    if (res.status !== 201) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body.attachment as { id: string; version: number; sha256: string };
  } finally {
    if (reopen) await PlanModel.update({ status: 'approved' }, { where: { id: owners.approvedPlan.ownerId } });
  }
}

/** GET …/content with the body as raw bytes, whatever the content type. */
function download(agent: Agent, id: string) {
  return agent
    .get(`/api/v1/attachments/${id}/content`)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
}

async function filesUnder(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { recursive: true, withFileTypes: true });
  return entries.filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}

/** Everything an upload could leave behind. */
async function storedState() {
  return {
    rows: await AttachmentModel.count({ paranoid: false }),
    audits: await AuditEventModel.count({ where: { entityType: 'attachment' } }),
    stored: (await filesUnder(filesDir)).sort(),
    incoming: await filesUnder(tempDir),
  };
}

/** Runs `act` and checks it left no row, no audit event, no stored file and no temp file. */
async function expectNothingStored(act: () => Promise<request.Response>) {
  const before = await storedState();
  const res = await act();
  expect(await storedState()).toEqual({ ...before, incoming: [] });
  expect(before.incoming).toEqual([]);
  return res;
}

// ------------------------------------------------------------------ roles × organisations

type Role = keyof typeof DEMO;
type Route = 'list' | 'get' | 'content' | 'upload' | 'patch' | 'delete';
type Owner = keyof typeof owners;

const ROLES: Role[] = ['admin', 'planner', 'reviewer', 'observer', 'otherAdmin', 'otherPlanner'];
const ROUTES: Route[] = ['list', 'get', 'content', 'upload', 'patch', 'delete'];
const OWNERS: Owner[] = ['post', 'site', 'approvedPlan', 'draftPlan'];

/** What each role may do, as the brief states it; everything else in the table follows from these rules. */
function expected(role: Role, route: Route, owner: Owner): number {
  const otherOrganisation = role === 'otherAdmin' || role === 'otherPlanner';
  const isWrite = route === 'upload' || route === 'patch' || route === 'delete';
  if (isWrite) {
    if (role !== 'planner' && role !== 'otherPlanner') return 403; // only planners write
    if (otherOrganisation) return 404; // never reveal another organisation's records
    if (owner === 'approvedPlan') return 409; // a submitted or approved plan's files are part of its record
    return { upload: 201, patch: 200, delete: 204 }[route];
  }
  if (otherOrganisation) return 404;
  if (role === 'observer' && owner === 'draftPlan') return 404; // observers see approved plans only
  return 200;
}

const MATRIX = ROLES.flatMap((role) => ROUTES.flatMap((route) => OWNERS.map((owner) => [role, route, owner] as const)));

describe('roles × organisations on every attachment route', () => {
  it.each(MATRIX.map(([role, route, owner]) => [role, route, owner, expected(role, route, owner)] as const))(
    '%s %s on a %s attachment → %i',
    async (role, route, owner, status) => {
      const agent = agents[role];
      // A fresh attachment per case, so writes in one case never change another.
      const a = await uploadPhoto(owner, { caption: `${role} ${route}` });
      const res = await (async () => {
        switch (route) {
          case 'list':
            return agent.get(`/api/v1/attachments?ownerType=${owners[owner].ownerType}&ownerId=${owners[owner].ownerId}`);
          case 'get':
            return agent.get(`/api/v1/attachments/${a.id}`);
          case 'content':
            return agent.get(`/api/v1/attachments/${a.id}/content`);
          case 'upload':
            return upload(agent, photoOf(owner), { data: fixture('ridge-64x48.jpg'), name: 'ridge.jpg' });
          case 'patch':
            return agent.patch(`/api/v1/attachments/${a.id}`).send({ caption: 'changed', version: a.version });
          case 'delete':
            return agent.delete(`/api/v1/attachments/${a.id}`);
        }
      })();
      expect(res.status).toBe(status);
      if (status === 404) expect(res.body.error.code).toBe('not_found');
      if (status === 403) expect(res.body.error.code).toBe('forbidden');
      if (status === 409) expect(res.body.error.code).toBe('plan_frozen');
      if (route === 'list' && status === 200) expect(res.body.items.map((i: { id: string }) => i.id)).toContain(a.id);
      // A refused write changed nothing.
      if (status >= 400 && (route === 'patch' || route === 'delete')) {
        const row = await AttachmentModel.findByPk(a.id);
        expect(row).toMatchObject({ caption: `${role} ${route}`, version: 0 });
      }
    },
  );

  it('answers 401 when signed out, on every route', async () => {
    const a = await uploadPhoto();
    const anon = request(app);
    expect((await anon.get(`/api/v1/attachments?ownerType=post&ownerId=${owners.post.ownerId}`)).status).toBe(401);
    expect((await anon.get(`/api/v1/attachments/${a.id}`)).status).toBe(401);
    expect((await anon.get(`/api/v1/attachments/${a.id}/content`)).status).toBe(401);
    expect((await anon.patch(`/api/v1/attachments/${a.id}`).send({ caption: 'x', version: 0 })).status).toBe(401);
    expect((await anon.delete(`/api/v1/attachments/${a.id}`)).status).toBe(401);
    await expectNothingStored(async () => {
      const res = await upload(anon, photoOf('post'), { data: fixture('ridge-64x48.png'), name: 'a.png' });
      expect(res.status).toBe(401);
      return res;
    });
  });

  it('answers 404 for an owner that does not exist, and stores nothing', async () => {
    const res = await expectNothingStored(() =>
      upload(
        agents.planner,
        { ownerType: 'post', ownerId: '00000000-0000-4000-8000-000000000000', kind: 'photo' },
        {
          data: fixture('ridge-64x48.png'),
          name: 'a.png',
        },
      ),
    );
    expect(res.status).toBe(404);
  });
});

// ------------------------------------------------------------------ upload and read back

describe('uploading and reading back', () => {
  it.each([
    ['ridge-64x48.png', 'image/png', 64, 48],
    ['ridge-64x48.jpg', 'image/jpeg', 64, 48],
    ['ridge-64x48-progressive.jpg', 'image/jpeg', 64, 48],
    ['ridge-64x48.webp', 'image/webp', 64, 48],
    // EXIF orientation 6: stored 64 × 48, shown 48 × 64 (tests/fixtures/attachments/README.md).
    ['ridge-64x48-orientation6.jpg', 'image/jpeg', 48, 64],
  ])('keeps %s as a photo (%s, %i × %i) and streams the same bytes back', async (name, type, width, height) => {
    const data = fixture(name);
    const res = await upload(
      agents.planner,
      { ...owners.post, kind: 'photo', caption: 'Looking north-east over the old burn', bearingDeg: '45' },
      { data, name, type: 'application/octet-stream' },
    );
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({
      ...owners.post,
      kind: 'photo',
      originalName: name,
      contentType: type, // sniffed, not the declared application/octet-stream
      bytes: data.length,
      sha256: sha256(data),
      widthPx: width,
      heightPx: height,
      bearingDeg: 45,
      caption: 'Looking north-east over the old burn',
      uploadedBy: { name: 'Teodor Ashby' },
      version: 0,
    });
    const id = res.body.attachment.id;
    expect((await agents.observer.get(`/api/v1/attachments/${id}`)).body.attachment).toEqual(res.body.attachment);

    const content = await download(agents.observer, id);
    expect(content.status).toBe(200);
    expect(sha256(content.body as Buffer)).toBe(sha256(data));
    expect(content.headers['content-type']).toBe(type);
    expect(parseDisposition(content.headers['content-disposition']!)).toEqual({ type: 'inline', parameters: { filename: name } });
    expect(content.headers['cache-control']).toMatch(/^private\b/);
    expect(await AuditEventModel.count({ where: { entityId: id, action: 'create' } })).toBe(1);
  });

  it('keeps documents (PDF, CSV, text) for download, with their names and sniffed types', async () => {
    const cases = [
      {
        data: Buffer.from('%PDF-1.4\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n'),
        name: 'Tower lease.pdf',
        type: 'application/pdf',
      },
      { data: Buffer.from('bearing_deg,range_km\n45,12.5\n'), name: 'Sweep ranges.csv', type: 'text/csv; charset=utf-8' },
      { data: Buffer.from('Cab windows cleaned 2026-05-02.\n'), name: 'Log', type: 'text/plain; charset=utf-8' },
    ];
    for (const c of cases) {
      const res = await upload(
        agents.planner,
        { ...owners.site, kind: 'document' },
        { data: c.data, name: c.name, type: 'image/png' },
      );
      expect(res.status).toBe(201);
      expect(res.body.attachment).toMatchObject({ originalName: c.name, bytes: c.data.length, widthPx: null, bearingDeg: null });
      const got = await download(agents.reviewer, res.body.attachment.id);
      expect(got.headers['content-type']).toBe(c.type);
      expect(parseDisposition(got.headers['content-disposition']!)).toEqual({
        type: 'attachment',
        parameters: { filename: c.name },
      });
      expect(sha256(got.body as Buffer)).toBe(sha256(c.data));
    }
  });

  it('keeps a non-ASCII file name intact (RFC 6266 filename* in the download header)', async () => {
    const res = await upload(
      agents.planner,
      { ...owners.post, kind: 'photo' },
      { data: fixture('ridge-64x48.png'), name: 'Blick nach Süden.png' },
    );
    expect(res.status).toBe(201);
    expect(res.body.attachment.originalName).toBe('Blick nach Süden.png');
    const got = await agents.planner.get(`/api/v1/attachments/${res.body.attachment.id}/content`);
    expect(got.headers['content-disposition']).toBe(
      `inline; filename="Blick nach S?den.png"; filename*=UTF-8''Blick%20nach%20S%C3%BCden.png`,
    );
  });

  it('answers a repeated download with 304 when the browser already has it (ETag is the sha256)', async () => {
    const a = await uploadPhoto();
    const first = await agents.planner.get(`/api/v1/attachments/${a.id}/content`);
    expect(first.headers.etag).toBe(`"${a.sha256}"`);
    const again = await agents.planner.get(`/api/v1/attachments/${a.id}/content`).set('If-None-Match', first.headers.etag!);
    expect(again.status).toBe(304);
  });
});

// ------------------------------------------------------------------ refusals

describe('refused uploads store nothing', () => {
  it(`refuses a photo over ${PHOTO_MAX_BYTES} bytes with 413, naming the limit`, async () => {
    // A PNG signature followed by filler: the size is refused before the type is looked at.
    const big = Buffer.alloc(PHOTO_MAX_BYTES + 1, 7);
    fixture('ridge-64x48.png').copy(big);
    const res = await expectNothingStored(() => upload(agents.planner, photoOf('post'), { data: big, name: 'huge.png' }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(res.body.error.message).toMatch(/Photos can be at most 15\.0 MB; this file is 15\.0 MB/);
    expect(res.body.error.fields).toHaveProperty('file');
  });

  it(`refuses any file over ${DOCUMENT_MAX_BYTES} bytes with 413 while it is still arriving`, async () => {
    const big = Buffer.alloc(DOCUMENT_MAX_BYTES + 1, 0x61);
    const res = await expectNothingStored(() =>
      upload(agents.planner, { ...owners.site, kind: 'document' }, { data: big, name: 'huge.txt' }),
    );
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(res.body.error.message).toMatch(/25\.0 MB/);
  });

  it('accepts a document between the photo and document limits (16 MB of CSV)', async () => {
    const row = 'bearing_deg,range_km,seen\n';
    const csv = Buffer.from(row.repeat(Math.ceil((16 * 1024 * 1024) / row.length)));
    const res = await upload(agents.planner, { ...owners.site, kind: 'document' }, { data: csv, name: 'sweep.csv' });
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({ contentType: 'text/csv', bytes: csv.length, sha256: sha256(csv) });
  });

  it.each([
    ['a text file named .jpg', 'photo', Buffer.from('not a picture at all\n'), 'view.jpg', /This file is plain text/],
    [
      'a text file named .jpg, as a document',
      'document',
      Buffer.from('not a picture\n'),
      'view.jpg',
      /The name says a JPEG image/,
    ],
    ['a PDF as a photo', 'photo', Buffer.from('%PDF-1.7\n%%EOF\n'), 'scan.pdf', /This file is a PDF/],
    ['plain text as a photo', 'photo', Buffer.from('North: clear to the ridge'), 'note', /This file is plain text/],
    [
      'binary data',
      'document',
      Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00]),
      'bundle.zip',
      /not a type Kenning accepts/,
    ],
    [
      'a PNG named .jpg',
      'photo',
      fixture('ridge-64x48.png'),
      'ridge.jpg',
      /The name says a JPEG image, but the file is a PNG image/,
    ],
  ])('refuses %s with 415 unsupported_type', async (_what, kind, data, name, message) => {
    const owner = kind === 'photo' ? owners.post : owners.site;
    const res = await expectNothingStored(() => upload(agents.planner, { ...owner, kind }, { data, name, type: 'image/jpeg' }));
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_type');
    expect(res.body.error.message).toMatch(message);
    // The message says what is accepted.
    expect(res.body.error.message).toMatch(kind === 'photo' ? /JPEG, PNG or WebP, at most 15 MB/ : /PDF, plain text/);
    expect(res.body.error.fields).toHaveProperty('file');
  });

  it.each([
    ['PNG', 'ridge-64x48.png'],
    ['JPEG', 'ridge-64x48.jpg'],
    ['progressive JPEG', 'ridge-64x48-progressive.jpg'],
    ['WebP', 'ridge-64x48.webp'],
  ])('refuses a truncated %s with 415', async (label, name) => {
    const whole = fixture(name);
    for (const cut of [whole.length - 1, Math.floor(whole.length * 0.6)]) {
      const res = await expectNothingStored(() =>
        upload(agents.planner, photoOf('post'), { data: whole.subarray(0, cut), name }),
      );
      expect(res.status).toBe(415);
      expect(res.body.error.message).toMatch(new RegExp(`This ${label.replace('progressive ', '')} image is incomplete`));
    }
  });

  it('answers a missing file and bad fields with 400 and a reason per field', async () => {
    const missing = await expectNothingStored(() => upload(agents.planner, photoOf('post')));
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toEqual({ file: 'Choose a file to upload.' });

    const bad = await expectNothingStored(() =>
      upload(
        agents.planner,
        { ownerType: 'tower', ownerId: 'nope', kind: 'sketch', bearingDeg: 'north' },
        {
          data: fixture('ridge-64x48.png'),
          name: 'a.png',
        },
      ),
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['bearingDeg', 'kind', 'ownerId', 'ownerType']);

    const outOfRange = await expectNothingStored(() =>
      upload(agents.planner, photoOf('post', { bearingDeg: 400 }), { data: fixture('ridge-64x48.png'), name: 'a.png' }),
    );
    expect(outOfRange.body.error.fields).toEqual({ bearingDeg: 'Bearings run 0–360°.' });

    const documentBearing = await expectNothingStored(() =>
      upload(agents.planner, { ...owners.site, kind: 'document', bearingDeg: 90 }, { data: Buffer.from('a\n'), name: 'a.txt' }),
    );
    expect(documentBearing.body.error.fields).toEqual({ bearingDeg: 'Only photos have a bearing.' });

    const empty = await expectNothingStored(() =>
      upload(agents.planner, photoOf('post'), { data: Buffer.alloc(0), name: 'a.png' }),
    );
    expect(empty.body.error.fields).toEqual({ file: 'The file is empty.' });

    const twoFiles = await expectNothingStored(() =>
      upload(agents.planner, photoOf('post'), { data: fixture('ridge-64x48.png'), name: 'a.png' }).attach(
        'file',
        fixture('ridge-64x48.png'),
        'b.png',
      ),
    );
    expect(twoFiles.status).toBe(400);
    expect(twoFiles.body.error.fields).toHaveProperty('file');

    const json = await expectNothingStored(() => agents.planner.post('/api/v1/attachments').send(photoOf('post')));
    expect(json.status).toBe(400);
    expect(json.body.error.fields).toHaveProperty('file');
  });

  it('removes the stored file again when the database write fails', async () => {
    // Make the insert fail inside the transaction (this database is disposable).
    await db.query(`
      CREATE FUNCTION refuse_attachment() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RAISE EXCEPTION 'refused for the test'; END $$;
      CREATE TRIGGER refuse_attachment BEFORE INSERT ON attachments FOR EACH ROW EXECUTE FUNCTION refuse_attachment();
    `);
    const errors = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const res = await expectNothingStored(() =>
        upload(agents.planner, photoOf('post'), { data: fixture('ridge-64x48.png'), name: 'a.png' }),
      );
      expect(res.status).toBe(500);
      expect(errors).toHaveBeenCalled();
    } finally {
      errors.mockRestore();
      await db.query('DROP TRIGGER refuse_attachment ON attachments; DROP FUNCTION refuse_attachment()');
    }
  });
});

// ------------------------------------------------------------------ lists, edits, deletes

describe('listing, editing and deleting', () => {
  it('pages an owner’s attachments oldest first, and filters by kind', async () => {
    const { body } = await agents.planner
      .post(`/api/v1/sites/${owners.site.ownerId}/posts`)
      .send({ name: 'Paging post', kind: 'hilltop', location: { latDeg: 61.05, lonDeg: 14.1 }, groundElevationM: 300 })
      .expect(201);
    const owner = { ownerType: 'post', ownerId: body.post.id };
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) {
      const res = await upload(
        agents.planner,
        { ...owner, kind: 'photo', caption: `view ${i}` },
        { data: pngOf(8 + i, 6), name: `v${i}.png` },
      );
      ids.push(res.body.attachment.id);
    }
    await upload(agents.planner, { ...owner, kind: 'document' }, { data: Buffer.from('notes\n'), name: 'notes.txt' }).expect(201);

    const q = `ownerType=post&ownerId=${owner.ownerId}`;
    const page2 = await agents.observer.get(`/api/v1/attachments?${q}&kind=photo&page=2&pageSize=2`).expect(200);
    expect(page2.body).toMatchObject({ total: 5, page: 2, pageSize: 2 });
    expect(page2.body.items.map((a: { id: string }) => a.id)).toEqual(ids.slice(2, 4));
    const all = await agents.observer.get(`/api/v1/attachments?${q}`).expect(200);
    expect(all.body.total).toBe(6);
    const docs = await agents.observer.get(`/api/v1/attachments?${q}&kind=document`).expect(200);
    expect(docs.body.items.map((a: { originalName: string }) => a.originalName)).toEqual(['notes.txt']);

    const bad = await agents.observer.get(`/api/v1/attachments?ownerType=boat&pageSize=500`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['ownerId', 'ownerType', 'pageSize']);
  });

  it('edits caption and bearing with the version last seen; a stale version is a 409 that changes nothing', async () => {
    const a = await uploadPhoto('post', { caption: 'first', bearingDeg: 10 });
    const edited = await agents.planner
      .patch(`/api/v1/attachments/${a.id}`)
      .send({ caption: 'North-west', bearingDeg: 315, version: 0 });
    expect(edited.status).toBe(200);
    expect(edited.body.attachment).toMatchObject({ caption: 'North-west', bearingDeg: 315, version: 1 });
    const stale = await agents.planner.patch(`/api/v1/attachments/${a.id}`).send({ caption: 'Overwritten', version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect((await agents.planner.get(`/api/v1/attachments/${a.id}`)).body.attachment).toMatchObject({
      caption: 'North-west',
      version: 1,
    });
    const cleared = await agents.planner.patch(`/api/v1/attachments/${a.id}`).send({ bearingDeg: null, version: 1 });
    expect(cleared.body.attachment).toMatchObject({ bearingDeg: null, version: 2 });
    const bad = await agents.planner.patch(`/api/v1/attachments/${a.id}`).send({ bearingDeg: -5, caption: 'x'.repeat(501) });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['bearingDeg', 'caption', 'version']);
    const audit = await AuditEventModel.findAll({ where: { entityId: a.id, action: 'update' }, order: [['id', 'ASC']] });
    expect(audit).toHaveLength(2);
    expect(audit[0]!.summary).toMatchObject({ before: { caption: 'first' }, after: { caption: 'North-west' } });
  });

  it('refuses a bearing on a document', async () => {
    const doc = await upload(agents.planner, { ...owners.site, kind: 'document' }, { data: Buffer.from('a\n'), name: 'a.txt' });
    const res = await agents.planner.patch(`/api/v1/attachments/${doc.body.attachment.id}`).send({ bearingDeg: 90, version: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ bearingDeg: 'Only photos have a bearing.' });
  });

  it('soft-deletes: gone from reads and lists, the row and the bytes are kept', async () => {
    const a = await uploadPhoto('post');
    const row = await AttachmentModel.findByPk(a.id);
    await agents.planner.delete(`/api/v1/attachments/${a.id}`).expect(204);
    expect((await agents.planner.get(`/api/v1/attachments/${a.id}`)).status).toBe(404);
    expect((await agents.planner.get(`/api/v1/attachments/${a.id}/content`)).status).toBe(404);
    expect((await agents.planner.patch(`/api/v1/attachments/${a.id}`).send({ caption: 'x', version: 0 })).status).toBe(404);
    expect((await agents.planner.delete(`/api/v1/attachments/${a.id}`)).status).toBe(404);
    const list = await agents.planner.get(`/api/v1/attachments?ownerType=post&ownerId=${owners.post.ownerId}&pageSize=200`);
    expect(list.body.items.map((i: { id: string }) => i.id)).not.toContain(a.id);
    const kept = await AttachmentModel.findByPk(a.id, { paranoid: false });
    expect(kept?.deletedAt).toBeInstanceOf(Date);
    expect(existsSync(files.localPath(row!.storeKey))).toBe(true);
    expect(await AuditEventModel.count({ where: { entityId: a.id, action: 'delete' } })).toBe(1);
  });

  it('rejects an id that is not a uuid with a field error', async () => {
    const res = await agents.planner.get('/api/v1/attachments/not-an-id');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('id');
  });
});
