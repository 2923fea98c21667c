import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { jurisdictionByCode, requiredEscortSlots, slotLabel, type AssessmentDto, type UnmetCondition } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { MoveExtensionsRegistry, type MoveExtension, type PlanChangeContext, type TransitionContext } from '../moves/move-extensions';
import type { Move } from '../moves/moves.repository';
import { MovesService } from '../moves/moves.service';
import { ACTIVE_STATUSES, EscortBookingsService } from './escort-bookings.service';
import { EscortsRepository } from './escorts.repository';

const STATUS_TEXT = { requested: 'awaiting the vendor\u2019s answer', proposed: 'the vendor proposed other dates', open: 'not booked', confirmed: 'confirmed' } as const;
const name = (code: string) => jurisdictionByCode(code)?.name ?? code;

/**
 * The escort guard: `permits_received → escorts_booked` only when every position the assessment requires is
 * confirmed, for its jurisdictions and the move's dates. It recomputes from the current assessment, so a plan
 * change that raises the requirement shows as unmet again.
 */
@Injectable()
export class EscortsWorkflow implements MoveExtension, OnModuleInit {
  readonly name = 'escorts';

  constructor(
    private readonly registry: MoveExtensionsRegistry,
    private readonly moves: MovesService,
    private readonly bookings: EscortBookingsService,
    private readonly repo: EscortsRepository,
    private readonly audit: AuditService,
  ) {}

  onModuleInit(): void {
    this.registry.register(this);
  }

  async unmetConditions(ctx: TransitionContext): Promise<UnmetCondition[]> {
    if (ctx.to !== 'escorts_booked') return [];
    const coverage = await this.bookings.coverage(ctx.manager, ctx.move, ctx.assessment);
    return coverage.flatMap((s) =>
      s.jurisdictions
        .filter((j) => j.status !== 'confirmed')
        .map((j) => ({ code: 'escort_unconfirmed', jurisdiction: j.code, message: `${slotLabel(s.position, s.seat)} escort in ${j.name}: ${STATUS_TEXT[j.status]}` })),
    );
  }

  /** For the schedule check: the positions the assessment needs and the confirmed bookings' dates. */
  async scheduleFacts(ctx: { manager: EntityManager; move: Move; assessment: AssessmentDto }) {
    const slots = requiredEscortSlots(ctx.assessment.result.jurisdictions);
    if (!slots.length) return {};
    const confirmed = await this.repo.withStatus(ctx.manager, ctx.move.id, ['confirmed']);
    return {
      escortSlots: slots.map((s) => ({ label: slotLabel(s.position, s.seat), jurisdictions: s.jurisdictions.map((j) => j.code) })),
      escorts: confirmed.map((b) => ({ label: slotLabel(b.position, b.seat), jurisdictions: b.jurisdictions, startDate: b.startDate, endDate: b.endDate })),
    };
  }

  async transitionNotes(ctx: TransitionContext): Promise<string[]> {
    if (ctx.to !== 'escorts_booked') return [];
    const coverage = await this.bookings.coverage(ctx.manager, ctx.move, ctx.assessment);
    if (!coverage.length) {
      // where the issued permit records the escorts it governs them (whatever the rulebook had), else the rulebook answers
      const byPermit = ctx.assessment.result.jurisdictions.filter((j) => j.governedBy?.topics.includes('escorts'));
      const open = new Set([...ctx.assessment.result.summary.escortsNotOnFile, ...byPermit.map((j) => j.code)]);
      const known = ctx.assessment.result.jurisdictions.filter((j) => !open.has(j.code));
      const codes = known.map((j) => `${j.name} (rulebook v${ctx.assessment.ruleVersions[j.code] ?? '–'})`);
      return [
        ...(known.length ? [`no escort needed: the assessment asks for no escort in ${codes.join(', ')}`] : []),
        ...(byPermit.length ? [`no escort needed: the issued permit asks none in ${byPermit.map((j) => `${j.name} (${j.governedBy!.label})`).join(', ')}`] : []),
        ...(ctx.assessment.result.summary.escortsNotOnFile.length
          ? [`escorts not on file in the rulebook for ${ctx.assessment.result.summary.escortsNotOnFile.join(', ')}: taken from the issued permit`]
          : []),
      ];
    }
    return coverage.map((s) => `${slotLabel(s.position, s.seat)} confirmed: ${s.jurisdictions.map((j) => `${j.code} by ${j.vendor}`).join(', ')}`);
  }

  /** A plan change may need more escorts, other dates or other states: record which positions it left unmet. */
  async onPlanChanged(ctx: PlanChangeContext): Promise<void> {
    const active = await this.repo.countWithStatus(ctx.manager, ctx.after.id, ACTIVE_STATUSES);
    if (!active) return;
    const assessment = await this.moves.assessmentOf(ctx.after, new Date(), ctx.manager);
    const coverage = await this.bookings.coverage(ctx.manager, ctx.after, assessment);
    const unmet = coverage.flatMap((s) => s.jurisdictions.filter((j) => j.status !== 'confirmed').map((j) => `${slotLabel(s.position, s.seat)} in ${name(j.code)}: ${STATUS_TEXT[j.status]}`));
    if (!unmet.length) return;
    await this.audit.record(ctx.manager, {
      moveId: ctx.after.id, entity: 'move', entityId: ctx.after.id, action: 'escorts_unmet', actorId: ctx.actor.id,
      after: { changed: ctx.changed, unmet }, reason: 'plan changed',
    });
  }
}
