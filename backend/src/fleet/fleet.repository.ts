import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import type { TractorDto, TrailerDto } from '@amberline/common';
import { Tractor } from './entities/tractor.entity';
import { Trailer } from './entities/trailer.entity';

export const toTractorDto = (t: Tractor): TractorDto => ({
  id: t.id, unitNumber: t.unitNumber, plate: t.plate, ...t.spec, active: t.active, version: t.version, updatedAt: t.updatedAt.toISOString(),
});
export const toTrailerDto = (t: Trailer): TrailerDto => ({
  id: t.id, unitNumber: t.unitNumber, type: t.type, ...t.spec, active: t.active, version: t.version, updatedAt: t.updatedAt.toISOString(),
});

type Unit = typeof Tractor | typeof Trailer;

/** Tractors' and trailers' rows (other modules read units through here, not through the entities). */
@Injectable()
export class FleetRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  tractors(): Promise<Tractor[]> {
    return this.ds.manager.find(Tractor, { order: { unitNumber: 'ASC' } });
  }

  trailers(): Promise<Trailer[]> {
    return this.ds.manager.find(Trailer, { order: { unitNumber: 'ASC' } });
  }

  tractor(id: string, manager?: EntityManager): Promise<Tractor | null> {
    return (manager ?? this.ds.manager).findOneBy(Tractor, { id });
  }

  trailer(id: string, manager?: EntityManager): Promise<Trailer | null> {
    return (manager ?? this.ds.manager).findOneBy(Trailer, { id });
  }

  lock<E extends Unit>(m: EntityManager, kind: E, id: string): Promise<InstanceType<E> | null> {
    return m.findOne(kind, { where: { id }, lock: { mode: 'pessimistic_write' } }) as Promise<InstanceType<E> | null>;
  }

  byUnitNumber<E extends Unit>(m: EntityManager, kind: E, unitNumber: string): Promise<InstanceType<E> | null> {
    return m.findOneBy(kind, { unitNumber }) as Promise<InstanceType<E> | null>;
  }

  /** Inserts or updates (the version column moves on by itself). */
  save<E extends Unit>(m: EntityManager, kind: E, row: InstanceType<E>): Promise<InstanceType<E>> {
    return m.save(kind as typeof Tractor, row as Tractor) as unknown as Promise<InstanceType<E>>;
  }
}
