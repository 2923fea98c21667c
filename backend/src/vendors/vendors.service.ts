import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { DOMAIN_ERRORS, DomainError, vendorWarnings, type SessionUser, type VendorDto } from '@amberline/common';
import { AuditService, diff } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { UpdateVendorDto, VendorInputDto, VendorsQueryDto } from './dto/vendor.dto';
import type { Vendor } from './entities/vendor.entity';
import { VendorsRepository } from './vendors.repository';

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
    private readonly repo: VendorsRepository,
    private readonly audit: AuditService,
  ) {}

  async list(q: VendorsQueryDto, now: Date): Promise<VendorDto[]> {
    return (await this.repo.list(q)).map((v) => toVendorDto(v, now));
  }

  async get(id: string, manager?: EntityManager): Promise<Vendor> {
    const v = await this.repo.find(id, manager);
    if (!v) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No vendor ${id}`);
    return v;
  }

  async create(dto: VendorInputDto, actor: SessionUser, now: Date): Promise<VendorDto> {
    checkInput(dto);
    const saved = await this.repo.transaction(async (m) => {
      const v = await this.repo.save(
        m,
        this.repo.build({
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
    const saved = await this.repo.transaction(async (m) => {
      const before = await this.repo.lock(m, id);
      if (!before) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No vendor ${id}`);
      if (before.version !== dto.version) {
        throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, `This vendor was changed by someone else (version ${before.version}, yours ${dto.version}); reload it`, { currentVersion: before.version });
      }
      const after = this.repo.build({
        ...before,
        company: dto.company, contactName: dto.contactName, email: dto.email, phone: dto.phone, states: dto.states, operators: dto.operators,
        insurance: dto.insurance, vehicles: dto.vehicles, rates: dto.rates, notes: dto.notes?.trim() || null, active: dto.active ?? before.active,
      });
      const d = diff(auditView(before), auditView(after));
      if (!Object.keys(d.after).length) return before;
      after.version = before.version + 1;
      const v = await this.repo.save(m, after);
      await this.audit.record(m, { entity: 'vendor', entityId: id, action: 'updated', actorId: actor.id, before: d.before, after: d.after });
      return v;
    });
    return toVendorDto(saved, now);
  }
}
