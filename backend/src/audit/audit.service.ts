import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { HistoryEntryDto } from '@amberline/common';
import { AuditRepository } from './audit.repository';

export type AuditRecord = {
  moveId?: string | null;
  entity: string;
  entityId: string;
  action: string;
  actorId: string | null;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
};

/** The audit trail. Always written inside the transaction of the change it records. */
@Injectable()
export class AuditService {
  constructor(private readonly repo: AuditRepository) {}

  async record(manager: EntityManager, r: AuditRecord): Promise<void> {
    await this.repo.insert(manager, {
      moveId: r.moveId ?? null,
      entity: r.entity,
      entityId: r.entityId,
      action: r.action,
      actorId: r.actorId,
      before: (r.before ?? null) as object,
      after: (r.after ?? null) as object,
      reason: r.reason ?? null,
    });
  }

  async forMove(moveId: string): Promise<HistoryEntryDto[]> {
    const rows = await this.repo.forMove(moveId);
    return rows.map((e) => ({
      id: String(e.id),
      at: e.at.toISOString(),
      actor: e.actor ? { id: e.actor.id, name: e.actor.name } : null,
      entity: e.entity,
      entityId: e.entityId,
      action: e.action,
      before: e.before,
      after: e.after,
      reason: e.reason,
    }));
  }
}

/** The fields whose values differ, with before and after (for readable audit entries). */
export function diff(before: Record<string, unknown>, after: Record<string, unknown>): { before: Record<string, unknown>; after: Record<string, unknown> } {
  const b: Record<string, unknown> = {};
  const a: Record<string, unknown> = {};
  for (const k of Object.keys(after)) {
    if (JSON.stringify(before[k]) !== JSON.stringify(after[k])) {
      b[k] = before[k];
      a[k] = after[k];
    }
  }
  return { before: b, after: a };
}
