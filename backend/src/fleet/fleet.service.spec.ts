import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { TractorInputDto, TrailerInputDto } from './dto/fleet.dto';
import type { Tractor } from './entities/tractor.entity';
import type { FleetRepository } from './fleet.repository';
import { FleetService } from './fleet.service';

const admin: SessionUser = { id: '00000000-0000-4000-8000-00000000000a', email: 'admin@example.test', name: 'Admin', role: 'admin' };
const tractorInput: TractorInputDto = {
  unitNumber: 'T-1', plate: 'ABC123', steerTareLb: 11000, driveTareLb: 8000, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1, bumperToSteerIn: 36, widthIn: 102, heightIn: 130, driveAxleOffsetsFt: [0, 4.3],
};
const stored = (over: Partial<Tractor> = {}) => ({ id: 't1', unitNumber: 'T-1', plate: 'ABC123', spec: {}, active: true, version: 5, createdAt: new Date(), updatedAt: new Date(), ...over }) as Tractor;

function setup(rows: Tractor[]) {
  const saved: unknown[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    lock: async (_m: EntityManager, _k: unknown, id: string) => rows.find((r) => r.id === id) ?? null,
    byUnitNumber: async (_m: EntityManager, _k: unknown, u: string) => rows.find((r) => r.unitNumber === u) ?? null,
    save: async (_m: EntityManager, _k: unknown, row: Tractor) => (saved.push(row), { ...row, id: row.id ?? 'new', version: (row.version ?? 0) + 1, updatedAt: new Date() }),
    tractor: async () => null,
  } as unknown as FleetRepository;
  const audit = { record: async () => undefined } as unknown as AuditService;
  return { s: new FleetService(repo, audit), saved };
}

describe('FleetService.saveTractor', () => {
  it('says so when the tractor was changed since it was read', async () => {
    const { s, saved } = setup([stored()]);
    const e = await s.saveTractor(tractorInput, admin, 't1', 4).catch((x) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(saved).toHaveLength(0);
  });
  it('a tractor that does not exist is not found', async () => {
    const { s } = setup([]);
    expect((await s.saveTractor(tractorInput, admin, 't9', 1).catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
  it('refuses a unit number another tractor has (a 409 field error)', async () => {
    const { s } = setup([stored({ id: 't2', unitNumber: 'T-1' })]);
    await expect(s.saveTractor(tractorInput, admin)).rejects.toMatchObject({ code: 'validation_failed', details: [{ field: 'unitNumber' }] });
  });
  it('saves at the version read', async () => {
    const { s, saved } = setup([stored()]);
    expect(await s.saveTractor(tractorInput, admin, 't1', 5)).toMatchObject({ id: 't1', unitNumber: 'T-1', version: 6 });
    expect(saved).toHaveLength(1);
  });
  it('a tractor that is not on file is not found by id', async () => {
    const { s } = setup([]);
    expect((await s.tractor('t9').catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
});

describe('FleetService.saveTrailer', () => {
  it('refuses a deck that ends before it starts, naming the deck', async () => {
    const { s } = setup([]);
    const trailer = {
      unitNumber: 'R-1', type: 'step_deck', lengthIn: 636, widthIn: 102, decks: [{ name: 'lower', fromFrontIn: 200, toFrontIn: 100, heightIn: 40 }], tareLb: 15000, tareCgFromKingpinFt: 20,
      kingpinFromFrontIn: 36, axleOffsetsFt: [0, 4.1], axleGroupFromKingpinFt: 40, anchorPoints: [], gaugeCalibration: [],
    } as unknown as TrailerInputDto;
    await expect(s.saveTrailer(trailer, admin)).rejects.toMatchObject({ details: [{ field: 'decks[0].toFrontIn', reason: 'must be behind fromFrontIn' }] });
  });
});
