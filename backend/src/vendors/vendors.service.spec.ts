import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { UpdateVendorDto } from './dto/vendor.dto';
import type { Vendor } from './entities/vendor.entity';
import type { VendorsRepository } from './vendors.repository';
import { VendorsService } from './vendors.service';

const admin: SessionUser = { id: '00000000-0000-4000-8000-00000000000a', email: 'admin@example.test', name: 'Admin', role: 'admin' };
const input = (over: Partial<UpdateVendorDto> = {}): UpdateVendorDto =>
  ({
    company: 'Lone Star Pilots', contactName: 'Pat', email: 'pat@example.test', phone: '512 555 0100', states: ['TX', 'OK'], operators: [], vehicles: [],
    insurance: { liabilityLimitUsd: 1_000_000, expires: '2027-06-30' }, rates: { basis: 'per_mile', perMileUsd: 2 }, version: 2, ...over,
  }) as UpdateVendorDto;
const stored = (over: Partial<Vendor> = {}) => ({ id: 'v1', ...input(), notes: null, active: true, version: 2, createdAt: new Date(), updatedAt: new Date(), ...over }) as unknown as Vendor;

function setup(v: Vendor | null) {
  const saved: Vendor[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    lock: async () => v,
    find: async () => v,
    build: (f: Partial<Vendor>) => ({ createdAt: new Date(), updatedAt: new Date(), ...f }) as Vendor,
    save: async (_m: EntityManager, x: Vendor) => (saved.push(x), x),
  } as unknown as VendorsRepository;
  const audit = { record: async () => undefined } as unknown as AuditService;
  return { s: new VendorsService(repo, audit), saved };
}

const now = new Date('2026-12-01T15:00:00Z');

describe('VendorsService.update', () => {
  it('says so when the vendor was changed since it was read, with the current version', async () => {
    const { s, saved } = setup(stored({ version: 3 }));
    const e = await s.update('v1', input({ version: 2 }), admin, now).catch((x) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(e.details).toEqual({ currentVersion: 3 });
    expect(saved).toHaveLength(0);
  });
  it('a vendor that does not exist is not found', async () => {
    const { s } = setup(null);
    expect((await s.update('v1', input(), admin, now).catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
  it('refuses a state listed twice (a field error)', async () => {
    const { s } = setup(stored());
    await expect(s.update('v1', input({ states: ['TX', 'TX'] }), admin, now)).rejects.toMatchObject({ details: [{ field: 'states', reason: 'TX is listed twice' }] });
  });
  it('refuses a per-mile basis without a rate per mile', async () => {
    const { s } = setup(stored());
    await expect(s.update('v1', input({ rates: { basis: 'per_mile' } } as Partial<UpdateVendorDto>), admin, now)).rejects.toMatchObject({ details: [{ field: 'rates.perMileUsd' }] });
  });
  it('an unchanged vendor keeps its version', async () => {
    const { s, saved } = setup(stored());
    expect((await s.update('v1', input(), admin, now)).version).toBe(2);
    expect(saved).toHaveLength(0);
  });
  it('a change moves the version on', async () => {
    const { s, saved } = setup(stored());
    expect((await s.update('v1', input({ phone: '512 555 0199' }), admin, now)).version).toBe(3);
    expect(saved).toHaveLength(1);
  });
});
