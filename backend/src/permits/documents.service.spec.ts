import { createHash } from 'node:crypto';
import { PDFDocument } from 'pdf-lib';
import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { DocumentsRepository } from './documents.repository';
import { DocumentsService } from './documents.service';
import type { PermitDocument } from './entities/permit-document.entity';
import type { Permit } from './entities/permit.entity';
import type { PermitsRepository } from './permits.repository';
import type { PermitsService } from './permits.service';
import type { FileStore } from './storage/file-store';

const clerk: SessionUser = { id: '00000000-0000-4000-8000-000000000001', email: 'clerk@example.test', name: 'Clerk', role: 'permit_clerk' };

async function pdf(): Promise<Buffer> {
  const d = await PDFDocument.create();
  d.addPage();
  return Buffer.from(await d.save());
}

function setup(permit: Partial<Permit> | null, existing: PermitDocument[] = []) {
  const puts: Buffer[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    findSame: async (_m: EntityManager, _p: string, sha: string) => existing.find((d) => d.sha256 === sha) ?? null,
    nextVersion: async () => existing.length + 1,
    insert: async () => 'd-new',
    withUploader: async () => ({ id: 'd-new', version: existing.length + 1, fileName: 'x.pdf', sizeBytes: 1, sha256: 'x', uploadedAt: new Date(), uploadedBy: null }),
    countByStorageKey: async () => 0,
  } as unknown as DocumentsRepository;
  const permits = { lock: async () => permit } as unknown as PermitsRepository;
  const store = { put: async (b: Buffer) => (puts.push(b), { key: 'k', sha256: 's', created: true }), remove: async () => undefined } as unknown as FileStore;
  const audit = { record: async () => undefined } as unknown as AuditService;
  return { s: new DocumentsService(repo, permits, audit, {} as PermitsService, store), puts };
}

describe('DocumentsService.upload', () => {
  it('refuses the same PDF a second time, naming the version it is already', async () => {
    const buf = await pdf();
    const sha = createHash('sha256').update(buf).digest('hex');
    const { s, puts } = setup({ id: 'p1', status: 'issued' }, [{ id: 'd1', version: 1, fileName: 'TX.pdf', sha256: sha } as PermitDocument]);
    const e = await s.upload('p1', { originalname: 'again.pdf', size: buf.length, buffer: buf }, clerk).catch((x) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.ALREADY_DONE);
    expect(e.message).toBe('This PDF is already attached to the permit as version 1 (TX.pdf)');
    expect(e.details).toEqual({ documentId: 'd1', version: 1 });
    expect(puts).toHaveLength(0);
  });

  it('takes no documents on a void permit', async () => {
    const buf = await pdf();
    const { s } = setup({ id: 'p1', status: 'void' });
    expect((await s.upload('p1', { originalname: 'a.pdf', size: buf.length, buffer: buf }, clerk).catch((x) => x)).code).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
  });

  it('a permit that does not exist is not found', async () => {
    const buf = await pdf();
    const { s } = setup(null);
    expect((await s.upload('p1', { originalname: 'a.pdf', size: buf.length, buffer: buf }, clerk).catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });

  it('refuses a file that is not a PDF as a field error, before anything is stored', async () => {
    const { s, puts } = setup({ id: 'p1', status: 'issued' });
    const buf = Buffer.from('hello');
    await expect(s.upload('p1', { originalname: 'a.pdf', size: buf.length, buffer: buf }, clerk)).rejects.toMatchObject({ code: 'validation_failed', details: [{ field: 'file' }] });
    expect(puts).toHaveLength(0);
  });

  it('stores a new PDF as the next version', async () => {
    const buf = await pdf();
    const { s, puts } = setup({ id: 'p1', status: 'issued', moveId: 'm1', jurisdiction: 'TX' });
    expect(await s.upload('p1', { originalname: '../TX permit', size: buf.length, buffer: buf }, clerk)).toMatchObject({ id: 'd-new', version: 1 });
    expect(puts).toHaveLength(1);
  });
});
