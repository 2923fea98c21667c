import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { RunSheetEscort, RunSheetPermit } from '@amberline/common';
import type { Move } from '../moves/entities/move.entity';

/** Where the run sheet gets a move's permits and escorts: the permit and escort modules register here. */
export interface RunSheetSource {
  readonly name: string;
  permits?(move: Move, manager: EntityManager): Promise<RunSheetPermit[]>;
  escorts?(move: Move, manager: EntityManager): Promise<RunSheetEscort[]>;
  /** The smallest permitted dimensions across the move's issued permits, if any. */
  permittedDimensions?(move: Move, manager: EntityManager): Promise<{ heightIn: number; widthIn: number; lengthIn: number } | null>;
}

@Injectable()
export class RunSheetSourcesRegistry {
  private readonly list: RunSheetSource[] = [];
  register(s: RunSheetSource): void {
    if (!this.list.some((x) => x.name === s.name)) this.list.push(s);
  }
  all(): readonly RunSheetSource[] {
    return this.list;
  }
}
