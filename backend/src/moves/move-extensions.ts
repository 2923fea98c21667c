import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { MoveStage, SessionUser, UnmetCondition } from '@amberline/common';
import type { AssessmentDto, PermitTerms, ScheduleInput } from '@amberline/common';
import type { Move } from './entities/move.entity';

export type TransitionContext = { manager: EntityManager; move: Move; to: MoveStage; assessment: AssessmentDto; actor: SessionUser };
export type PlanChangeContext = { manager: EntityManager; before: Move; after: Move; changed: string[]; actor: SessionUser };

/**
 * How other modules (permits, escorts, run sheets) take part in a move's workflow without the moves module
 * knowing them: each registers itself in onModuleInit.
 */
export interface MoveExtension {
  readonly name: string;
  /** Conditions not yet met for moving into `ctx.to`; runs inside the transition's transaction, the move row locked. */
  unmetConditions?(ctx: TransitionContext): Promise<UnmetCondition[]>;
  /** Extra lines for the audit entry of a transition that passed (e.g. "no escort needed: …"). */
  transitionNotes?(ctx: TransitionContext): Promise<string[]>;
  /** Runs in the transition's transaction after the stage changed (e.g. cancelling closes what belongs to the move). */
  afterTransition?(ctx: TransitionContext & { from: MoveStage }): Promise<void>;
  /** Runs in the same transaction when dimensions, weights, equipment or the route change. */
  onPlanChanged?(ctx: PlanChangeContext): Promise<void>;
  /** What the schedule check needs from this module: issued permits' validity, escort positions and confirmed bookings. */
  scheduleFacts?(ctx: { manager: EntityManager; move: Move; assessment: AssessmentDto }): Promise<Partial<Pick<ScheduleInput, 'permits' | 'escortSlots' | 'escorts'>>>;
  /** Issued permits' recorded terms by jurisdiction: they govern the move's travel windows and escorts. */
  permitTerms?(move: Move, manager: EntityManager): Promise<Record<string, PermitTerms>>;
}

@Injectable()
export class MoveExtensionsRegistry {
  private readonly list: MoveExtension[] = [];
  register(ext: MoveExtension): void {
    if (!this.list.some((e) => e.name === ext.name)) this.list.push(ext);
  }
  all(): readonly MoveExtension[] {
    return this.list;
  }
}
