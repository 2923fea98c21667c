import { createHash } from 'node:crypto';
import { Inject, Injectable, Logger } from '@nestjs/common';
import type { Readable } from 'node:stream';
import { PDFDocument } from 'pdf-lib';
import { DOMAIN_ERRORS, DomainError, type PermitDocumentDto, type SessionUser } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { DocumentsRepository } from './documents.repository';
import { toDocumentDto } from './permit-mappers';
import { storedFileName } from './permit-input';
import { PermitsRepository } from './permits.repository';
import { PermitsService } from './permits.service';
import { FILE_STORE, type FileStore } from './storage/file-store';

/** Largest permit PDF accepted. */
export const MAX_PDF_BYTES = 15 * 1024 * 1024;
const PDF_MAGIC = Buffer.from('%PDF-', 'latin1');

export type UploadedPdf = { originalname: string; size: number; buffer: Buffer };

/** Throws a 400 naming the reason unless `buf` is a PDF that pdf-lib can read and that has at least one page. */
export async function checkPdf(buf: Buffer): Promise<{ pages: number }> {
  if (buf.length === 0) throw fieldError('file', 'the file is empty');
  if (buf.length > MAX_PDF_BYTES) throw fieldError('file', `the file is larger than ${MAX_PDF_BYTES / 1024 / 1024} MB`, 413);
  if (buf.length < PDF_MAGIC.length || !buf.subarray(0, PDF_MAGIC.length).equals(PDF_MAGIC)) {
    throw fieldError('file', 'is not a PDF (a PDF starts with %PDF-); export the permit as PDF and upload that');
  }
  let pages = 0;
  try {
    const doc = await PDFDocument.load(buf, { ignoreEncryption: true, updateMetadata: false, throwOnInvalidObject: true });
    pages = doc.getPageCount();
  } catch (e) {
    throw fieldError('file', `is not a readable PDF (${(e as Error).message.split('\n')[0].slice(0, 160)})`);
  }
  if (pages < 1) throw fieldError('file', 'is a PDF without pages');
  return { pages };
}

/** Permit PDFs: checked, stored once by content, every version kept; served only to the people who need them. */
@Injectable()
export class DocumentsService {
  private readonly logger = new Logger('PermitDocuments');
  constructor(
    private readonly repo: DocumentsRepository,
    private readonly permitRows: PermitsRepository,
    private readonly audit: AuditService,
    private readonly permits: PermitsService,
    @Inject(FILE_STORE) private readonly store: FileStore,
  ) {}

  /**
   * Adds a version. The same PDF uploaded again to the same permit is refused with 409 (it is already there).
   * Nothing is kept of a refused upload: checks run before anything is written, and the stored file is removed
   * again when the database insert fails.
   */
  async upload(permitId: string, file: UploadedPdf | undefined, actor: SessionUser): Promise<PermitDocumentDto> {
    if (!file) throw fieldError('file', 'attach the permit PDF in the multipart field "file"');
    const fileName = storedFileName(file.originalname);
    await checkPdf(file.buffer);
    let stored: { key: string; sha256: string; created: boolean } | null = null;
    try {
      const id = await this.repo.transaction(async (m) => {
        const permit = await this.permitRows.lock(m, permitId);
        if (!permit) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No permit ${permitId}`);
        if (permit.status === 'void') throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, 'A void permit takes no documents');
        const sha = createHash('sha256').update(file.buffer).digest('hex');
        const same = await this.repo.findSame(m, permitId, sha);
        if (same) throw new DomainError(DOMAIN_ERRORS.ALREADY_DONE, `This PDF is already attached to the permit as version ${same.version} (${same.fileName})`, { documentId: same.id, version: same.version });
        const v = await this.repo.nextVersion(m, permitId);
        stored = await this.store.put(file.buffer);
        const inserted = await this.repo.insert(m, {
          permitId, version: v, fileName, sha256: stored.sha256, sizeBytes: file.buffer.length, contentType: 'application/pdf', storageKey: stored.key, uploadedById: actor.id,
        });
        await this.audit.record(m, {
          moveId: permit.moveId, entity: 'permit', entityId: permitId, action: 'document_added', actorId: actor.id,
          after: { jurisdiction: permit.jurisdiction, version: v, fileName, sha256: stored.sha256, sizeBytes: file.buffer.length },
        });
        return inserted;
      });
      return toDocumentDto(await this.repo.withUploader(id));
    } catch (e) {
      const s = stored as { key: string; created: boolean } | null;
      if (s?.created) {
        if ((await this.repo.countByStorageKey(s.key)) === 0) await this.store.remove(s.key).catch((err) => this.logger.warn(`could not remove ${s.key}: ${(err as Error).message}`));
      }
      throw e;
    }
  }

  /** The file of one version, for clerks, dispatchers, admins and the move's assigned driver. */
  async open(permitId: string, docId: string, viewer: SessionUser): Promise<{ stream: Readable; size: number; fileName: string; contentType: string }> {
    await this.permits.load(permitId, viewer);
    const doc = await this.repo.find(permitId, docId);
    if (!doc) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No document ${docId} on permit ${permitId}`);
    const { stream, size } = await this.store.open(doc.storageKey);
    return { stream, size, fileName: doc.fileName, contentType: doc.contentType };
  }
}
