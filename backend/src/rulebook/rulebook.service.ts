import { Injectable, Logger, OnApplicationBootstrap } from '@nestjs/common';
import { LRUCache } from 'lru-cache';
import {
  assessJurisdiction, blankRecord, DOMAIN_ERRORS, DomainError, factsOf, isFactRecord, rulebookCoverage, validateJurisdictionRule, JURISDICTIONS, jurisdictionByCode, RULEBOOK_DATA,
  type JurisdictionRule, type JurisdictionSummaryDto, type RuleVersionDto, type RulebookCoverage, type SessionUser,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import type { RuleVersion } from './entities/rule-version.entity';
import { RulebookRepository } from './rulebook.repository';

/** The starting record of a jurisdiction: its data file (`common/src/rulebook/data`), else every topic not on file. */
export function initialRecord(code: string, name: string): JurisdictionRule {
  return RULEBOOK_DATA[code] ?? blankRecord(code, name, new Date().toISOString().slice(0, 10), 'no data file for this jurisdiction');
}

/** True when no value of the record is on file (the `sample` column: nothing in it has been read in a text). */
const nothingOnFile = (r: JurisdictionRule): boolean => factsOf(r).every(([, f]) => f.status === 'unknown');


const toVersionDto = (v: RuleVersion): RuleVersionDto => ({
  code: v.code, version: v.version, record: v.record, note: v.note, createdBy: v.createdBy?.name ?? null, createdAt: v.createdAt.toISOString(),
});

/** Throws a 400 naming the part of a rule record that is missing or wrong. */
export function checkRuleRecord(code: string, r: JurisdictionRule): void {
  try {
    validateJurisdictionRule(r);
  } catch (e) {
    if (e instanceof RangeError) {
      const field = e.message.split(/[\s:]/)[0].replace(/^rule/, 'record');
      throw fieldError(field || 'record', e.message.replace(/^rule/, 'record'));
    }
    throw e;
  }
  if (r.code !== code) throw fieldError('record.code', `must be ${code}`);
  // a dry run through the engine on a typical wide load catches anything else the engine cannot read
  try {
    assessJurisdiction(r, {
      dimensions: { widthIn: 168, heightIn: 170, lengthIn: 900, frontOverhangIn: 0, rearOverhangIn: 60, sideProjectionIn: 33, sideProjectionLeftIn: 33, sideProjectionRightIn: 33, rearProjectionWidthIn: 168, grossLb: 95000 },
      axles: [{ positionFt: 0, weightLb: 12000 }, { positionFt: 20, weightLb: 17000 }, { positionFt: 24.3, weightLb: 17000 }, { positionFt: 60, weightLb: 24500 }, { positionFt: 64.3, weightLb: 24500 }],
      miles: 100,
      roadTypes: ['two-lane', 'interstate'],
    } as Parameters<typeof assessJurisdiction>[1]);
  } catch (e) {
    throw fieldError('record', `the engine cannot use this record: ${(e as Error).message}`);
  }
}

@Injectable()
export class RulebookService implements OnApplicationBootstrap {
  private readonly logger = new Logger('Rulebook');
  /** Rule records by rule-version id (immutable rows; see currentRules). */
  private readonly records = new LRUCache<string, JurisdictionRule>({ max: 200 });

  constructor(
    private readonly repo: RulebookRepository,
    private readonly audit: AuditService,
  ) {}

  /** Every jurisdiction gets a first version on first start; safe when several servers start at once. */
  async onApplicationBootstrap(): Promise<void> {
    await this.repo.transaction(async (m) => {
      await this.repo.lockBootstrap(m);
      const have = new Set(await this.repo.codes(m));
      const missing = JURISDICTIONS.filter((j) => !have.has(j.code));
      for (const j of missing) {
        const record = initialRecord(j.code, j.name);
        await this.repo.insertJurisdiction(m, { code: j.code, name: j.name, currentVersion: 1 });
        await this.repo.insertVersion(m, { code: j.code, version: 1, record, sample: nothingOnFile(record), asOf: record.asOf, note: 'initial record (rulebook data file)', createdById: null });
      }
      if (missing.length) this.logger.log(`rulebook: added ${missing.length} jurisdictions`);
      // a database started before records were facts: its current records get the data files as a new version
      const stale = await this.repo.staleCurrent(m);
      for (const s of stale) {
        const record = initialRecord(s.code, jurisdictionByCode(s.code)?.name ?? s.code);
        const version = s.current_version + 1;
        await this.repo.insertVersion(m, { code: s.code, version, record, sample: nothingOnFile(record), asOf: record.asOf, note: 'sourced rulebook: every value with its own source, not on file where none was read', createdById: null });
        await this.repo.setCurrentVersion(m, s.code, version);
      }
      if (stale.length) this.logger.log(`rulebook: ${stale.length} records moved to the sourced rulebook`);
    });
  }

  /** Jurisdictions × topics: each cell sourced, secondary, partly or not on file; the counts; the oldest as-of date. */
  async coverage(): Promise<RulebookCoverage> {
    // the current records, through the same version-keyed cache the assessments read
    const current = await this.currentRules(JURISDICTIONS.map((j) => j.code));
    return rulebookCoverage([...current.values()].filter((r) => isFactRecord(r.record)).map((r) => ({ record: r.record, version: r.version })));
  }

  async list(): Promise<JurisdictionSummaryDto[]> {
    const rows = await this.repo.summaries();
    return rows.map((r) => ({ code: r.code, name: r.name, version: r.version, sample: r.sample, asOf: r.as_of, updatedAt: new Date(r.created_at).toISOString() }));
  }

  async current(code: string): Promise<RuleVersionDto> {
    const j = await this.repo.jurisdiction(code.toUpperCase());
    if (!j) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No jurisdiction ${code}`);
    const v = await this.repo.version(j.code, j.currentVersion);
    return toVersionDto(v!);
  }

  async history(code: string): Promise<RuleVersionDto[]> {
    const rows = await this.repo.history(code.toUpperCase());
    if (!rows.length) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No jurisdiction ${code}`);
    return rows.map(toVersionDto);
  }

  /** Current records for the given codes, with their versions. Unknown codes are left out. */
  /**
   * The current rule record of each jurisdiction. A rule version row is never changed once written (a change is a
   * new version), so records are kept here by the row's id and the database sends only those not yet held.
   */
  async currentRules(codes: string[]): Promise<Map<string, { id: string; record: JurisdictionRule; version: number }>> {
    if (!codes.length) return new Map();
    const rows = await this.repo.currentRules(codes, [...this.records.keys()]);
    const out = new Map<string, { id: string; record: JurisdictionRule; version: number }>();
    for (const r of rows) {
      // a record evicted between the key list and this line is simply read again next time
      const record = r.record ?? this.records.get(r.id) ?? (await this.recordById(r.id));
      this.records.set(r.id, record);
      out.set(r.code, { id: r.id, record, version: r.version });
    }
    return out;
  }

  /**
   * The rule records a move's assessment uses: the pinned version for each code that has one (a move past
   * `requested` keeps the versions it was assessed with), the current version for the rest.
   */
  async rulesFor(codes: string[], pinned: Record<string, number> | null): Promise<Map<string, { id: string; record: JurisdictionRule; version: number }>> {
    const current = await this.currentRules(codes);
    const wanted = Object.entries(pinned ?? {}).filter(([code, v]) => codes.includes(code) && current.get(code)?.version !== v);
    if (!wanted.length) return current;
    const rows = await this.repo.versionIds(wanted);
    for (const r of rows) {
      const record = this.records.get(r.id) ?? (await this.recordById(r.id));
      this.records.set(r.id, record);
      current.set(r.code, { id: r.id, record, version: r.version });
    }
    return current;
  }

  /** The current version number of each code. */
  async currentVersions(codes: string[]): Promise<Record<string, number>> {
    const rows = await this.repo.currentVersions(codes);
    return Object.fromEntries(rows.map((r) => [r.code, r.current_version]));
  }

  private recordById(id: string): Promise<JurisdictionRule> {
    return this.repo.recordById(id);
  }

  async update(codeRaw: string, record: JurisdictionRule, note: string, actor: SessionUser): Promise<RuleVersionDto> {
    const code = codeRaw.toUpperCase();
    if (!jurisdictionByCode(code)) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No jurisdiction ${code}`);
    checkRuleRecord(code, record);
    const id = await this.repo.transaction(async (m) => {
      const j = await this.repo.lockJurisdiction(m, code);
      if (!j) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No jurisdiction ${code}`);
      const version = j.currentVersion + 1;
      const inserted = await this.repo.insertVersion(m, { code, version, record, sample: nothingOnFile(record), asOf: record.asOf, note, createdById: actor.id });
      await this.repo.setCurrentVersion(m, code, version);
      await this.audit.record(m, { entity: 'rule', entityId: code, action: 'new_version', actorId: actor.id, before: { version: j.currentVersion }, after: { version }, reason: note });
      return inserted;
    });
    const v = await this.repo.versionById(id);
    return toVersionDto(v!);
  }
}
