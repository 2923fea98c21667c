import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import { PermitDocument } from './entities/permit-document.entity';

/** The permit PDFs' rows (the bytes live in the file store under `storageKey`). */
@Injectable()
export class DocumentsRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** The version of this permit with the same content, if any. */
  findSame(m: EntityManager, permitId: string, sha256: string): Promise<PermitDocument | null> {
    return m.findOneBy(PermitDocument, { permitId, sha256 });
  }

  async nextVersion(m: EntityManager, permitId: string): Promise<number> {
    const [{ v }] = await m.query(`SELECT COALESCE(max(version), 0)::int + 1 AS v FROM permit_documents WHERE permit_id = $1`, [permitId]);
    return v;
  }

  async insert(m: EntityManager, d: Omit<PermitDocument, 'id' | 'uploadedAt' | 'uploadedBy'>): Promise<string> {
    const inserted = await m.insert(PermitDocument, d);
    return inserted.identifiers[0].id as string;
  }

  withUploader(id: string): Promise<PermitDocument> {
    return this.ds.manager.findOneOrFail(PermitDocument, { where: { id }, relations: { uploadedBy: true } });
  }

  find(permitId: string, id: string): Promise<PermitDocument | null> {
    return this.ds.manager.findOneBy(PermitDocument, { id, permitId });
  }

  /** How many versions (of any permit) point at the stored file. */
  async countByStorageKey(key: string): Promise<number> {
    const [{ n }] = await this.ds.query(`SELECT count(*)::int AS n FROM permit_documents WHERE storage_key = $1`, [key]);
    return n;
  }
}
