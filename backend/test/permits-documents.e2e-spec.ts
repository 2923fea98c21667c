import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { PermitDto, Role } from '@amberline/common';
import { seedTractor, seedTrailer } from '@amberline/seed';
import { texasMove } from './fixtures/moves';
import { makePdf, PNG_1X1 } from './fixtures/permits';
import { createTestApp, type TestApp } from './utils/create-test-app';

/** Every file under a folder (recursive), for "nothing was left behind" checks. */
const filesUnder = (dir: string): string[] =>
  existsSync(dir) ? readdirSync(dir, { recursive: true, encoding: 'utf8' }).filter((f) => statSync(join(dir, f)).isFile()) : [];

describe('permit PDFs', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  const ids = {} as Record<Role, string>;
  let store: string;
  let permit: PermitDto;
  let otherPermit: PermitDto;
  beforeAll(async () => {
    store = mkdtempSync(join(tmpdir(), 'amberline-files-'));
    process.env.FILE_STORE_DIR = store;
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) {
      tokens[role] = users[role].token;
      ids[role] = users[role].id;
    }
    const tractorId = (await seedTractor(t.ds)).id;
    const trailerId = (await seedTrailer(t.ds)).id;
    const mk = async (over = {}) => {
      const move = (await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, over))).body;
      await t.http().post(`/api/moves/${move.id}/permits/sync`).set(as('permit_clerk'));
      return (await t.http().get(`/api/moves/${move.id}/permits`).set(as('permit_clerk'))).body[0] as PermitDto;
    };
    permit = await mk({ driverId: ids.driver });
    otherPermit = await mk();
  });
  afterAll(async () => {
    await t.close();
    rmSync(store, { recursive: true, force: true });
  });
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });
  const upload = (id: string, data: Buffer, name: string | { filepath: string }, role: Role = 'permit_clerk') =>
    t.http().post(`/api/permits/${id}/documents`).set(as(role)).attach('file', data, typeof name === 'string' ? { filename: name, contentType: 'application/pdf' } : { ...name, contentType: 'application/pdf' });
  const docRows = async (permitId: string) => (await t.ds.query(`SELECT count(*)::int AS n FROM permit_documents WHERE permit_id = $1`, [permitId]))[0].n as number;

  it('accepts a real PDF, stores it by SHA-256 and streams it back with its headers', async () => {
    const pdf = await makePdf('Texas single-trip permit');
    const sha = createHash('sha256').update(pdf).digest('hex');
    const res = await upload(permit.id, pdf, 'TX permit 2026-55871.pdf');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ version: 1, fileName: 'TX permit 2026-55871.pdf', sizeBytes: pdf.length, sha256: sha, uploadedBy: { id: ids.permit_clerk } });
    expect(existsSync(join(store, sha.slice(0, 2), sha))).toBe(true);

    const dl = await t.http().get(`/api/permits/${permit.id}/documents/${res.body.id}`).set(as('dispatcher')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(dl.status).toBe(200);
    expect(dl.headers['content-type']).toBe('application/pdf');
    expect(dl.headers['content-length']).toBe(String(pdf.length));
    expect(dl.headers['content-disposition']).toContain('filename="TX permit 2026-55871.pdf"');
    expect(createHash('sha256').update(dl.body as Buffer).digest('hex')).toBe(sha);
    const hist = (await t.http().get(`/api/moves/${permit.moveId}/history`).set(as('dispatcher'))).body;
    expect(hist.find((h: { action: string }) => h.action === 'document_added').after).toMatchObject({ version: 1, sha256: sha });
  });

  it('keeps every version; the same PDF twice is refused with 409 and adds nothing', async () => {
    const v2 = await makePdf('Texas permit, amended');
    const first = await upload(permit.id, v2, 'amended.pdf');
    expect(first.status).toBe(201);
    expect(first.body.version).toBe(2);
    const before = await docRows(permit.id);
    const again = await upload(permit.id, v2, 'amended-again.pdf');
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/already attached to the permit as version 2/);
    expect(await docRows(permit.id)).toBe(before);
    const detail: PermitDto = (await t.http().get(`/api/permits/${permit.id}`).set(as('permit_clerk'))).body;
    expect(detail.documents.map((d) => d.version)).toEqual([2, 1]);
    expect(detail.documentCount).toBe(2);
    // the same content on another permit is fine, and stored once
    const other = await upload(otherPermit.id, v2, 'shared.pdf');
    expect(other.status).toBe(201);
    expect(filesUnder(store).filter((f) => f.endsWith(first.body.sha256))).toHaveLength(1);
  });

  describe('rejected uploads leave nothing behind', () => {
    it.each([
      ['a PNG renamed .pdf', () => PNG_1X1, 'scan.pdf', 400, /not a PDF/],
      ['an empty file', () => Buffer.alloc(0), 'empty.pdf', 400, /empty/],
      ['a file that starts like a PDF but is not one', () => Buffer.from('%PDF-1.7\nthis is not really a PDF at all\n'), 'fake.pdf', 400, /not a readable PDF|without pages/],
      ['a PDF over 15 MB', () => Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(15 * 1024 * 1024 + 1, 0x20)]), 'huge.pdf', 413, /too large/i],
    ] as [string, () => Buffer, string, number, RegExp][])('%s is refused', async (_name, data, fileName, status, message) => {
      const files = filesUnder(store).length;
      const rows = await docRows(otherPermit.id);
      const res = await upload(otherPermit.id, data(), fileName);
      expect(res.status).toBe(status);
      expect(res.body.message).toMatch(message);
      if (status === 400) expect(res.body.details).toEqual([{ field: 'file', reason: expect.any(String) }]);
      expect(filesUnder(store).length).toBe(files);
      expect(await docRows(otherPermit.id)).toBe(rows);
    });

    it('no file at all → 400 naming the field', async () => {
      const res = await t.http().post(`/api/permits/${otherPermit.id}/documents`).set(as('permit_clerk')).field('note', 'x');
      expect(res.status).toBe(400);
      expect(res.body.details[0]).toEqual({ field: 'file', reason: expect.stringMatching(/multipart field "file"/) });
    });
  });

  it('file names lose their path parts; a name of dots only is refused', async () => {
    const tricky = await upload(otherPermit.id, await makePdf('path trick'), { filepath: '../../../etc/cron.d/permit.pdf' });
    expect(tricky.status).toBe(201);
    expect(tricky.body.fileName).toBe('permit.pdf');
    const win = await upload(otherPermit.id, await makePdf('windows trick'), 'C:\\Users\\clerk\\..\\permit<script>.pdf');
    expect(win.status).toBe(201);
    expect(win.body.fileName).not.toMatch(/[\\/<>]/);
    expect(win.body.fileName).toMatch(/\.pdf$/);
    const dots = await upload(otherPermit.id, await makePdf('dots'), '..');
    expect(dots.status).toBe(400);
    expect(dots.body.details[0].field).toBe('file');
    // nothing was written outside the store
    expect(filesUnder(store).every((f) => /^[0-9a-f]{2}[\\/][0-9a-f]{64}$/.test(f))).toBe(true);
  });

  it('only clerks and admins upload; clerks, dispatchers, admins and the assigned driver download', async () => {
    const pdf = await makePdf('role check');
    expect((await upload(permit.id, pdf, 'd.pdf', 'dispatcher')).status).toBe(403);
    expect((await upload(permit.id, pdf, 'd.pdf', 'driver')).status).toBe(403);
    const ok = await upload(permit.id, pdf, 'a.pdf', 'admin');
    expect(ok.status).toBe(201);
    const url = `/api/permits/${permit.id}/documents/${ok.body.id}`;
    for (const role of ['admin', 'dispatcher', 'permit_clerk', 'driver'] as Role[]) expect((await t.http().get(url).set(as(role))).status).toBe(200);
    expect((await t.http().get(url)).status).toBe(401);
    // a driver not on the other move sees nothing of it
    const otherDoc = (await t.http().get(`/api/permits/${otherPermit.id}`).set(as('permit_clerk'))).body.documents[0];
    expect((await t.http().get(`/api/permits/${otherPermit.id}/documents/${otherDoc.id}`).set(as('driver'))).status).toBe(404);
    // a document id of another permit is not served under this one
    expect((await t.http().get(`/api/permits/${permit.id}/documents/${otherDoc.id}`).set(as('admin'))).status).toBe(404);
  });
});
