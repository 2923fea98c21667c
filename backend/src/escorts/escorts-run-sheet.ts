import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { BOOKING_STATUS_LABELS, slotLabel, type RunSheetEscort } from '@amberline/common';
import type { Move } from '../moves/moves.repository';
import { RunSheetSourcesRegistry, type RunSheetSource } from '../run-sheets/run-sheet-sources';
import { ACTIVE_STATUSES } from './escort-bookings.service';
import { EscortsRepository } from './escorts.repository';

/** Gives the driver's run sheet the move's escorts: who runs which position where, their phone and the meeting point. */
@Injectable()
export class EscortsRunSheetSource implements RunSheetSource, OnModuleInit {
  readonly name = 'escorts';
  constructor(
    private readonly registry: RunSheetSourcesRegistry,
    private readonly repo: EscortsRepository,
  ) {}

  onModuleInit(): void {
    this.registry.register(this);
  }

  async escorts(move: Move, manager: EntityManager): Promise<RunSheetEscort[]> {
    const rows = await this.repo.runSheetEscorts(manager, move.id, ACTIVE_STATUSES);
    return rows.map((b) => ({
      jurisdiction: b.jurisdictions.join(', '),
      position: slotLabel(b.position, b.seat),
      status: BOOKING_STATUS_LABELS[b.status].toLowerCase(),
      vendor: b.company,
      operator: b.status === 'confirmed' ? (b.answer?.operatorName ?? null) : null,
      phone: b.status === 'confirmed' ? (b.answer?.phone ?? b.phone) : b.phone,
      meetingPoint: b.meetingPoint,
      meetingTime: b.meetingTime,
    }));
  }
}
