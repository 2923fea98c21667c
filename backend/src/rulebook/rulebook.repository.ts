import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import type { JurisdictionRule } from '@amberline/common';
import { preparedQuery } from '../database/prepared';
import { Jurisdiction } from './entities/jurisdiction.entity';
import { RuleVersion } from './entities/rule-version.entity';

export type CurrentRuleRow = { id: string; code: string; version: number; record: JurisdictionRule | null };
export type RuleSummaryRow = { code: string; name: string; version: number; sample: boolean; as_of: string; created_at: Date };
export type NewRuleVersion = { code: string; version: number; record: JurisdictionRule; sample: boolean; asOf: string; note: string | null; createdById: string | null };

/** The rulebook's rows: jurisdictions with their current version number, and every version of each record. */
@Injectable()
export class RulebookRepository {
  constructor(private readonly ds: DataSource) {}

  transaction<T>(fn: (m: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** Holds the first-start work to one server at a time (until the transaction ends). */
  async lockBootstrap(m: EntityManager): Promise<void> {
    await m.query(`SELECT pg_advisory_xact_lock(hashtext('amberline.rulebook.bootstrap'))`);
  }

  async codes(m: EntityManager): Promise<string[]> {
    return (await m.find(Jurisdiction)).map((j) => j.code);
  }

  async insertJurisdiction(m: EntityManager, j: { code: string; name: string; currentVersion: number }): Promise<void> {
    await m.insert(Jurisdiction, j);
  }

  async insertVersion(m: EntityManager, v: NewRuleVersion): Promise<string> {
    const inserted = await m.insert(RuleVersion, v);
    return inserted.identifiers[0].id as string;
  }

  async setCurrentVersion(m: EntityManager, code: string, currentVersion: number): Promise<void> {
    await m.update(Jurisdiction, { code }, { currentVersion });
  }

  /** Jurisdictions whose current record predates facts (no `schema: 2`). */
  staleCurrent(m: EntityManager): Promise<{ code: string; current_version: number }[]> {
    return m.query(
      `SELECT j.code, j.current_version FROM jurisdictions j JOIN rule_versions v ON v.code = j.code AND v.version = j.current_version
        WHERE NOT (v.record ? 'schema') OR v.record->>'schema' <> '2'`,
    );
  }

  summaries(): Promise<RuleSummaryRow[]> {
    return this.ds.query(
      `SELECT j.code, j.name, v.version, v.sample, to_char(v.as_of, 'YYYY-MM-DD') AS as_of, v.created_at
         FROM jurisdictions j JOIN rule_versions v ON v.code = j.code AND v.version = j.current_version ORDER BY j.name`,
    );
  }

  jurisdiction(code: string): Promise<Jurisdiction | null> {
    return this.ds.manager.findOneBy(Jurisdiction, { code });
  }

  lockJurisdiction(m: EntityManager, code: string): Promise<Jurisdiction | null> {
    return m.findOne(Jurisdiction, { where: { code }, lock: { mode: 'pessimistic_write' } });
  }

  version(code: string, version: number): Promise<RuleVersion | null> {
    return this.ds.manager.findOne(RuleVersion, { where: { code, version }, relations: { createdBy: true } });
  }

  versionById(id: string): Promise<RuleVersion | null> {
    return this.ds.manager.findOne(RuleVersion, { where: { id }, relations: { createdBy: true } });
  }

  history(code: string): Promise<RuleVersion[]> {
    return this.ds.manager.find(RuleVersion, { where: { code }, relations: { createdBy: true }, order: { version: 'DESC' } });
  }

  /** The current version of each code; the record left out (null) for the version ids in `held`. */
  currentRules(codes: string[], held: string[]): Promise<CurrentRuleRow[]> {
    return preparedQuery<CurrentRuleRow>(
      this.ds,
      `SELECT v.id, v.code, v.version, CASE WHEN v.id = ANY($2::uuid[]) THEN NULL ELSE v.record END AS record
         FROM jurisdictions j JOIN rule_versions v ON v.code = j.code AND v.version = j.current_version
        WHERE j.code = ANY($1) ORDER BY v.code`,
      [codes, held],
    );
  }

  /** The ids of the given (code, version) pairs. */
  versionIds(wanted: [string, number][]): Promise<{ id: string; code: string; version: number }[]> {
    return preparedQuery<{ id: string; code: string; version: number }>(
      this.ds,
      `SELECT v.id, v.code, v.version FROM rule_versions v JOIN unnest($1::varchar[], $2::int[]) w(code, version) ON v.code = w.code AND v.version = w.version`,
      [wanted.map(([c]) => c), wanted.map(([, v]) => v)],
    );
  }

  currentVersions(codes: string[]): Promise<{ code: string; current_version: number }[]> {
    return this.ds.query(`SELECT code, current_version FROM jurisdictions WHERE code = ANY($1)`, [codes]);
  }

  async recordById(id: string): Promise<JurisdictionRule> {
    const [row] = await this.ds.query(`SELECT record FROM rule_versions WHERE id = $1`, [id]);
    return row.record;
  }
}
