import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { BOOKING_STATUS_LABELS, slotLabel, type RunSheetEscort } from '@amberline/common';
import type { Move } from '../moves/entities/move.entity';
import { RunSheetSourcesRegistry, type RunSheetSource } from '../run-sheets/run-sheet-sources';
import { EscortBooking } from './entities/escort-booking.entity';
import { ACTIVE_STATUSES } from './escort-bookings.service';

/** Gives the driver's run sheet the move's escorts: who runs which position where, their phone and the meeting point. */
@Injectable()
export class EscortsRunSheetSource implements RunSheetSource, OnModuleInit {
  readonly name = 'escorts';
  constructor(private readonly registry: RunSheetSourcesRegistry) {}

  onModuleInit(): void {
    this.registry.register(this);
  }

  async escorts(move: Move, manager: EntityManager): Promise<RunSheetEscort[]> {
    const rows = await manager.find(EscortBooking, {
      where: { moveId: move.id, status: In([...ACTIVE_STATUSES]) },
      relations: { vendor: true },
      order: { position: 'ASC', seat: 'ASC', id: 'ASC' },
    });
    return rows.map((b) => ({
      jurisdiction: b.jurisdictions.join(', '),
      position: slotLabel(b.position, b.seat),
      status: BOOKING_STATUS_LABELS[b.status].toLowerCase(),
      vendor: b.vendor?.company ?? null,
      operator: b.status === 'confirmed' ? (b.answer?.operatorName ?? null) : null,
      phone: b.status === 'confirmed' ? (b.answer?.phone ?? b.vendor?.phone ?? null) : (b.vendor?.phone ?? null),
      meetingPoint: b.meetingPoint,
      meetingTime: b.meetingTime,
    }));
  }
}
