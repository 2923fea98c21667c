import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { BOOKING_STATUS_LABELS, slotLabel, type RunSheetEscort } from '@amberline/common';
import type { Move } from '../moves/entities/move.entity';
import { RunSheetSourcesRegistry, type RunSheetSource } from '../run-sheets/run-sheet-sources';
import { preparedQuery } from '../database/prepared';
import type { EscortBooking } from './entities/escort-booking.entity';
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
    const rows = await preparedQuery<EscortRow>(
      manager,
      `SELECT b.jurisdictions, b.position, b.seat, b.status, b.answer, b.meeting_point AS "meetingPoint", b.meeting_time AS "meetingTime",
              v.company, v.phone
         FROM escort_bookings b JOIN vendors v ON v.id = b.vendor_id
        WHERE b.move_id = $1 AND b.status = ANY($2::varchar[])
        ORDER BY b.position, b.seat, b.id`,
      [move.id, [...ACTIVE_STATUSES]],
    );
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

type EscortRow = Pick<EscortBooking, 'jurisdictions' | 'position' | 'seat' | 'status' | 'answer' | 'meetingPoint' | 'meetingTime'> & { company: string; phone: string };
