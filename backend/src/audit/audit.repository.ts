import { Injectable } from '@nestjs/common';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditEntry } from './entities/audit-entry.entity';

/** `before`/`after` are JSON values (null when the entry has none). */
export type NewAuditEntry = Pick<AuditEntry, 'moveId' | 'entity' | 'entityId' | 'action' | 'actorId' | 'reason'> & { before: object; after: object };

/** The audit trail's table: entries are inserted in the caller's transaction and read per move, oldest first. */
@Injectable()
export class AuditRepository {
  constructor(private readonly ds: DataSource) {}

  async insert(manager: EntityManager, entry: NewAuditEntry): Promise<void> {
    await manager.getRepository(AuditEntry).insert(entry);
  }

  /** A move's entries, oldest first, each with its actor. */
  forMove(moveId: string): Promise<AuditEntry[]> {
    return this.ds.getRepository(AuditEntry).find({ where: { moveId }, relations: { actor: true }, order: { at: 'ASC', id: 'ASC' } });
  }
}
