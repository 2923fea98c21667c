import { Injectable } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { canTransition, MOVE_STAGE_LABELS, type MoveDto, type SessionUser, type UnmetCondition } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { AppException, fieldError } from '../core/app-exception';
import { StageChangeDto } from './dto/move.dto';
import { Move } from './entities/move.entity';
import { MoveExtensionsRegistry, type TransitionContext } from './move-extensions';
import { MovesService, toMoveDto } from './moves.service';

/** The conditions the moves module itself checks; permits, escorts and run sheets add theirs as extensions. */
export function baseConditions(ctx: Pick<TransitionContext, 'move' | 'to' | 'assessment'>): UnmetCondition[] {
  const out: UnmetCondition[] = [];
  const r = ctx.assessment.result;
  if (ctx.to === 'running') {
    if (!ctx.move.driverId) out.push({ code: 'driver_missing', message: 'assign a driver before the move runs' });
    for (const s of r.securement) {
      if (!s.ok) out.push({ code: 'securement_short', message: `securement of ${s.articleId} falls short: ${s.findings.join('; ')}` });
    }
  }
  return out;
}

@Injectable()
export class WorkflowService {
  constructor(
    private readonly ds: DataSource,
    private readonly moves: MovesService,
    private readonly audit: AuditService,
    private readonly extensions: MoveExtensionsRegistry,
  ) {}

  async transition(id: string, dto: StageChangeDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    if (dto.to === 'cancelled' && !dto.reason?.trim()) throw fieldError('reason', 'say why the move is cancelled');
    await this.ds.transaction(async (manager) => {
      // the row lock makes two simultaneous transitions run one after the other: the second sees the first's result
      const locked = await manager.findOne(Move, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!locked) throw new AppException(404, 'not_found', `No move ${id}`);
      const move = await this.moves.get(id, undefined, manager);
      if (dto.version !== undefined && dto.version !== move.version) {
        throw new AppException(409, 'conflict', `This move was changed by someone else (version ${move.version}, yours ${dto.version}); reload it`);
      }
      if (!canTransition(move.stage, dto.to)) {
        const unmet = [{ code: 'not_a_step', message: `a move cannot go from ${MOVE_STAGE_LABELS[move.stage]} to ${MOVE_STAGE_LABELS[dto.to]}` }];
        throw new AppException(409, 'conflict', unmet[0].message, { unmet });
      }
      const assessment = await this.moves.assessmentOf(move, now, manager);
      const ctx: TransitionContext = { manager, move, to: dto.to, assessment, actor };
      const unmet: UnmetCondition[] = dto.to === 'cancelled' ? [] : [...baseConditions(ctx)];
      const notes: string[] = [];
      if (dto.to !== 'cancelled') {
        for (const ext of this.extensions.all()) {
          if (ext.unmetConditions) unmet.push(...(await ext.unmetConditions(ctx)));
        }
      }
      if (unmet.length) {
        throw new AppException(409, 'conflict', `Cannot move to ${MOVE_STAGE_LABELS[dto.to]}: ${unmet.map((u) => u.message).join('; ')}`, { unmet });
      }
      for (const ext of this.extensions.all()) if (ext.transitionNotes) notes.push(...(await ext.transitionNotes(ctx)));
      await manager.update(Move, { id }, { stage: dto.to, version: move.version + 1, updatedAt: now });
      for (const ext of this.extensions.all()) if (ext.afterTransition) await ext.afterTransition({ ...ctx, from: move.stage });
      await this.audit.record(manager, {
        moveId: id, entity: 'move', entityId: id, action: 'stage', actorId: actor.id,
        before: { stage: move.stage }, after: { stage: dto.to, ruleVersions: assessment.ruleVersions, ...(notes.length ? { notes } : {}) },
        reason: dto.reason ?? null,
      });
    });
    return toMoveDto(await this.moves.get(id));
  }
}
