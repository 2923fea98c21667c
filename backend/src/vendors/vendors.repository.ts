import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import { Vendor } from './entities/vendor.entity';

export type VendorFilter = { includeInactive?: boolean; state?: string; search?: string };

/** Escort vendors' rows (other modules read vendors through here or VendorsService, not through the entity). */
@Injectable()
export class VendorsRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** At most 500, by company. */
  list(q: VendorFilter): Promise<Vendor[]> {
    const qb = this.ds.manager.createQueryBuilder(Vendor, 'v');
    if (!q.includeInactive) qb.andWhere('v.active = true');
    if (q.state) qb.andWhere(':s = ANY(v.states)', { s: q.state });
    if (q.search?.trim()) {
      qb.andWhere(`(v.company || ' ' || v.contact_name || ' ' || v.email) ILIKE :q`, { q: `%${q.search.trim().replace(/[%_\\]/g, '\\$&')}%` });
    }
    return qb.orderBy('v.company', 'ASC').addOrderBy('v.id', 'ASC').take(500).getMany();
  }

  find(id: string, manager?: EntityManager): Promise<Vendor | null> {
    return (manager ?? this.ds.manager).findOneBy(Vendor, { id });
  }

  lock(m: EntityManager, id: string): Promise<Vendor | null> {
    return m.findOne(Vendor, { where: { id }, lock: { mode: 'pessimistic_write' } });
  }

  /** A vendor object to save (new, or `base` with changes). */
  build(fields: Partial<Vendor>): Vendor {
    return this.ds.manager.create(Vendor, fields);
  }

  save(m: EntityManager, v: Vendor): Promise<Vendor> {
    return m.save(v);
  }
}
