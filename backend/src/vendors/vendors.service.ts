import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { DataSource, EntityManager, Repository } from 'typeorm';
import { vendorWarnings, type SessionUser, type VendorDto } from '@amberline/common';
import { AuditService, diff } from '../audit/audit.service';
import { AppException, fieldError } from '../core/app-exception';
import { UpdateVendorDto, VendorInputDto, VendorsQueryDto } from './dto/vendor.dto';
import { Vendor } from './entities/vendor.entity';

const today = (now: Date) => now.toISOString().slice(0, 10);
/** A `YYYY-MM-DD` that names a day of the calendar (not 2027-02-30). */
export const isRealDate = (d: string): boolean => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().slice(0, 10) === d;

export function toVendorDto(v: Vendor, now: Date): VendorDto {
  return {
    id: v.id,
    company: v.company,
    contactName: v.contactName,
    email: v.email,
    phone: v.phone,
    states: v.states,
    operators: v.operators,
    insurance: v.insurance,
    vehicles: v.vehicles,
    rates: v.rates,
    notes: v.notes,
    active: v.active,
    version: v.version,
    warnings: vendorWarnings(v, today(now)),
    createdAt: v.createdAt.toISOString(),
    updatedAt: v.updatedAt.toISOString(),
  };
}

const auditView = (v: Vendor) => ({
  company: v.company, contactName: v.contactName, email: v.email, phone: v.phone, states: v.states, operators: v.operators,
  insurance: v.insurance, vehicles: v.vehicles, rates: v.rates, notes: v.notes, active: v.active,
});

function checkInput(dto: VendorInputDto): void {
  const states = new Set<string>();
  dto.states.forEach((s) => {
    if (states.has(s)) throw fieldError('states', `${s} is listed twice`);
    states.add(s);
  });
  for (const [field, d] of [['insurance.expires', dto.insurance.expires], ...dto.operators.flatMap((o, i) => o.certifications.map((c, k) => [`operators[${i}].certifications[${k}].expires`, c.expires]))]) {
    if (!isRealDate(d)) throw fieldError(field, 'is not a real date');
  }
  const r = dto.rates;
  if (r.basis === 'per_mile' && r.perMileUsd === undefined) throw fieldError('rates.perMileUsd', 'give the rate per mile for a per-mile basis');
  if (r.basis === 'per_day' && r.perDayUsd === undefined) throw fieldError('rates.perDayUsd', 'give the rate per day for a per-day basis');
}

/** Escort vendors: their coverage, operators and certificates, insurance, vehicles and rates. */
@Injectable()
export class VendorsService {
  constructor(
    private readonly ds: DataSource,
    private readonly audit: AuditService,
    @InjectRepository(Vendor) private readonly vendors: Repository<Vendor>,
  ) {}

  async list(q: VendorsQueryDto, now: Date): Promise<VendorDto[]> {
    const qb = this.vendors.createQueryBuilder('v');
    if (!q.includeInactive) qb.andWhere('v.active = true');
    if (q.state) qb.andWhere(':s = ANY(v.states)', { s: q.state });
    if (q.search?.trim()) {
      qb.andWhere(`(v.company || ' ' || v.contact_name || ' ' || v.email) ILIKE :q`, { q: `%${q.search.trim().replace(/[%_\\]/g, '\\$&')}%` });
    }
    const rows = await qb.orderBy('v.company', 'ASC').addOrderBy('v.id', 'ASC').take(500).getMany();
    return rows.map((v) => toVendorDto(v, now));
  }

  async get(id: string, manager?: EntityManager): Promise<Vendor> {
    const v = await (manager ?? this.ds.manager).findOneBy(Vendor, { id });
    if (!v) throw new AppException(404, 'not_found', `No vendor ${id}`);
    return v;
  }

  async create(dto: VendorInputDto, actor: SessionUser, now: Date): Promise<VendorDto> {
    checkInput(dto);
    const saved = await this.ds.transaction(async (m) => {
      const v = await m.save(
        m.create(Vendor, {
          company: dto.company, contactName: dto.contactName, email: dto.email, phone: dto.phone, states: dto.states, operators: dto.operators,
          insurance: dto.insurance, vehicles: dto.vehicles, rates: dto.rates, notes: dto.notes?.trim() || null, active: dto.active ?? true,
        }),
      );
      await this.audit.record(m, { entity: 'vendor', entityId: v.id, action: 'created', actorId: actor.id, after: auditView(v) });
      return v;
    });
    return toVendorDto(saved, now);
  }

  async update(id: string, dto: UpdateVendorDto, actor: SessionUser, now: Date): Promise<VendorDto> {
    checkInput(dto);
    const saved = await this.ds.transaction(async (m) => {
      const before = await m.findOne(Vendor, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!before) throw new AppException(404, 'not_found', `No vendor ${id}`);
      if (before.version !== dto.version) {
        throw new AppException(409, 'conflict', `This vendor was changed by someone else (version ${before.version}, yours ${dto.version}); reload it`, { currentVersion: before.version });
      }
      const after = m.create(Vendor, {
        ...before,
        company: dto.company, contactName: dto.contactName, email: dto.email, phone: dto.phone, states: dto.states, operators: dto.operators,
        insurance: dto.insurance, vehicles: dto.vehicles, rates: dto.rates, notes: dto.notes?.trim() || null, active: dto.active ?? before.active,
      });
      const d = diff(auditView(before), auditView(after));
      if (!Object.keys(d.after).length) return before;
      after.version = before.version + 1;
      const v = await m.save(after);
      await this.audit.record(m, { entity: 'vendor', entityId: id, action: 'updated', actorId: actor.id, before: d.before, after: d.after });
      return v;
    });
    return toVendorDto(saved, now);
  }
}
