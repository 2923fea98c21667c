import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  dayPlan, defaultDailyMiles, jurisdictionByCode, scheduleCheck, travelDates,
  type AssessmentDto, type DayPlan, type ScheduleDto, type ScheduleInput,
} from '@amberline/common';
import type { Move } from './entities/move.entity';
import { MoveExtensionsRegistry } from './move-extensions';

/** The move's day plan: its route in order at the dispatcher's daily distance, or spread over the travel days. */
export function planOf(move: Pick<Move, 'route' | 'requestedDeparture' | 'travelDays' | 'dailyMiles'>): DayPlan {
  const segments = move.route.map((s) => ({ order: s.order, jurisdiction: s.jurisdiction, miles: s.miles }));
  const total = segments.reduce((s, x) => s + x.miles, 0);
  return dayPlan(segments, travelDates(move.requestedDeparture, move.travelDays), move.dailyMiles ?? defaultDailyMiles(total, move.travelDays));
}

/** The schedule check of a move: its day plan against travel windows, issued permits and confirmed escorts. */
@Injectable()
export class ScheduleService {
  constructor(private readonly extensions: MoveExtensionsRegistry) {}

  async forMove(move: Move, assessment: AssessmentDto, manager: EntityManager): Promise<ScheduleDto> {
    const facts: Pick<ScheduleInput, 'permits' | 'escortSlots' | 'escorts'> = { permits: {}, escortSlots: [], escorts: [] };
    for (const ext of this.extensions.all()) {
      if (!ext.scheduleFacts) continue;
      const f = await ext.scheduleFacts({ manager, move, assessment });
      Object.assign(facts.permits, f.permits ?? {});
      facts.escortSlots.push(...(f.escortSlots ?? []));
      facts.escorts.push(...(f.escorts ?? []));
    }
    const result = scheduleCheck({
      plan: planOf(move),
      travel: Object.fromEntries(assessment.result.jurisdictions.map((j) => [j.code, j.travel])),
      permitsNeeded: assessment.result.summary.permitsNeeded,
      ...facts,
      timeZoneOf: (code) => jurisdictionByCode(code)?.timeZone ?? 'America/Chicago',
    });
    return { ...result, moveId: move.id, moveVersion: move.version, dailyMilesSet: move.dailyMiles !== null };
  }
}
