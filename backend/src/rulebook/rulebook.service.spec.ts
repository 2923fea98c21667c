import { DOMAIN_ERRORS, DomainError, RULEBOOK_DATA, type JurisdictionRule, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { RulebookRepository } from './rulebook.repository';
import { checkRuleRecord, RulebookService } from './rulebook.service';

const admin: SessionUser = { id: '00000000-0000-4000-8000-00000000000a', email: 'admin@example.test', name: 'Admin', role: 'admin' };
const tx = (): JurisdictionRule => JSON.parse(JSON.stringify(RULEBOOK_DATA.TX));

function setup(current: { code: string; currentVersion: number } | null) {
  const versions: { code: string; version: number }[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    lockJurisdiction: async () => current,
    insertVersion: async (_m: EntityManager, v: { code: string; version: number }) => (versions.push(v), 'v-new'),
    setCurrentVersion: async () => undefined,
    versionById: async () => ({ code: 'TX', version: (current?.currentVersion ?? 0) + 1, record: tx(), note: 'n', createdBy: null, createdAt: new Date() }),
    jurisdiction: async () => null,
    history: async () => [],
  } as unknown as RulebookRepository;
  const audit = { record: async () => undefined } as unknown as AuditService;
  return { s: new RulebookService(repo, audit), versions };
}

describe('checkRuleRecord', () => {
  it('takes the shipped Texas record', () => {
    expect(() => checkRuleRecord('TX', tx())).not.toThrow();
  });
  it('refuses a record filed under another code, naming record.code', () => {
    expect(() => checkRuleRecord('OK', tx())).toThrow(expect.objectContaining({ code: 'validation_failed', details: [{ field: 'record.code', reason: 'must be OK' }] }));
  });
  it('refuses a record whose shape the engine does not read, naming the part', () => {
    const r = tx() as unknown as Record<string, unknown>;
    delete r.asOf;
    let err: unknown;
    try {
      checkRuleRecord('TX', r as unknown as JurisdictionRule);
    } catch (e) {
      err = e;
    }
    expect(err).toMatchObject({ code: 'validation_failed' });
    expect((err as { details: { field: string }[] }).details[0].field).toMatch(/^record/);
  });
});

describe('RulebookService.update', () => {
  it('a jurisdiction outside the rulebook is not found', async () => {
    const { s } = setup(null);
    const e = await s.update('ZZ', tx(), 'a note', admin).catch((x) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
  it('an edit is a new version after the current one', async () => {
    const { s, versions } = setup({ code: 'TX', currentVersion: 3 });
    await s.update('tx', tx(), 'read the 2026 manual', admin);
    expect(versions).toEqual([expect.objectContaining({ code: 'TX', version: 4, note: 'read the 2026 manual', createdById: admin.id })]);
  });
  it('history of an unknown code is not found', async () => {
    const { s } = setup(null);
    expect((await s.history('ZZ').catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
});
