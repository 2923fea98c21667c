import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { LRUCache } from 'lru-cache';
import {
  defaultWll, PLANNING_CAUTION, planCheck, ANCHOR_KIND_LABELS, travelDates,
  type AssessmentDto, type MoveArticle, type PermitTerms, type PlanArticle, type PlanCheckResult, type PlanInput, type RouteSegmentDto, type TiedownSpec,
} from '@amberline/common';
import { fieldError } from '../core/app-exception';
import { RulebookService } from '../rulebook/rulebook.service';
import type { MoveSummary } from './entities/move.entity';
import type { MoveTractor, MoveTrailer } from './moves.repository';

/** The facts of a plan, whether saved on a move or still a draft. */
export type PlanFacts = {
  articles: MoveArticle[];
  route: RouteSegmentDto[];
  requestedDeparture: string;
  travelDays: number;
  sliderSettingFt?: number | null;
  tractor: MoveTractor;
  trailer: MoveTrailer;
};

/** Each day of travel from the departure date: the rule lives in common (`@amberline/common`); kept here for older imports. */
export { travelDates };

/** Resolves one planned tiedown to the WLL the engine credits, naming the field when it cannot. */
export function resolveTiedown(t: MoveArticle['tiedowns'][number], trailer: MoveTrailer, field: string): TiedownSpec {
  let wllLb = t.markedWllLb;
  if (wllLb === undefined) {
    try {
      if (t.kind === 'chain') wllLb = defaultWll({ kind: 'chain', size: t.chainSize ?? '', ...(t.chainGrade ? { grade: t.chainGrade } : {}) }).wllLb;
      else if (t.kind === 'webbing') wllLb = defaultWll({ kind: 'webbing', width: t.webbingWidth ?? '' }).wllLb;
      else throw new RangeError('give the marked WLL for this tiedown');
    } catch (e) {
      throw fieldError(`${field}.markedWllLb`, (e as Error).message);
    }
  }
  const anchor = trailer.spec.anchorPoints.find((a) => a.kind === t.anchorKind);
  if (!anchor) throw fieldError(`${field}.anchorKind`, `trailer ${trailer.unitNumber} has no ${ANCHOR_KIND_LABELS[t.anchorKind].toLowerCase()} anchor points`);
  return {
    label: t.label ?? `${t.kind}${t.chainSize ? ` ${t.chainSize}` : ''}${t.chainGrade ? ` G${t.chainGrade}` : ''}${t.webbingWidth ? ` ${t.webbingWidth} in` : ''}`,
    wllLb,
    anchorWllLb: anchor.wllLb,
    anchorKind: ANCHOR_KIND_LABELS[t.anchorKind],
    path: t.path,
    ...(t.edgeProtection !== undefined ? { edgeProtection: t.edgeProtection } : {}),
  };
}

/** Runs the engine's full plan check on a move's facts with the current rulebook. */
@Injectable()
export class AssessmentService {
  /**
   * Results of the plan check by the SHA-256 of its whole input (plan, equipment, route, dates, and the rule
   * records by their immutable version ids), so any change to any of them is a different key and nothing needs
   * invalidating. The
   * check is a pure function of that input; a move page, its assessment and its run sheet ask for the same one.
   * Results are shared: callers only read and serialize them.
   */
  private readonly results = new LRUCache<string, PlanCheckResult>({ max: 500 }); // a result is ~20–40 kB

  constructor(private readonly rulebook: RulebookService) {}

  /**
   * `pinned`: the rule versions a move past `requested` keeps (codes not in it use the current version);
   * `permits`: issued permits' recorded terms, which govern travel and escorts in their state.
   */
  async assess(
    facts: PlanFacts,
    opts: { pinned?: Record<string, number> | null; permits?: Record<string, PermitTerms> } = {},
  ): Promise<{ result: PlanCheckResult; ruleVersions: Record<string, number> }> {
    const codes = [...new Set(facts.route.map((s) => s.jurisdiction))];
    const rules = await this.rulebook.rulesFor(codes, opts.pinned ?? null);
    const plan = this.toPlanInput(facts, [...rules.values()].map((r) => r.record));
    if (opts.permits && Object.keys(opts.permits).length) plan.permits = opts.permits;
    // rule records are immutable per version row, so their ids stand for them in the key
    const key = createHash('sha256').update(JSON.stringify({ ...plan, rules: [...rules.values()].map((r) => r.id) })).digest('base64');
    let result = this.results.get(key);
    if (!result) {
      try {
        result = planCheck(plan);
      } catch (e) {
        if (e instanceof RangeError) throw fieldError(e.message.split(/[\s:]/)[0] || 'plan', e.message);
        throw e;
      }
      this.results.set(key, result);
    }
    return { result, ruleVersions: Object.fromEntries([...rules].map(([c, r]) => [c, r.version])) };
  }

  toPlanInput(f: PlanFacts, rules: PlanInput['rules']): PlanInput {
    const tractor = f.tractor.spec;
    const trailer = f.trailer.spec;
    const articles: PlanArticle[] = f.articles.map((a, i) => {
      const { description, weightSource, tiedowns, ...placed } = a;
      void weightSource;
      return { ...placed, description, tiedowns: tiedowns.map((t, k) => resolveTiedown(t, f.trailer, `articles[${i}].tiedowns[${k}]`)) };
    });
    return {
      tractor: {
        steerTareLb: tractor.steerTareLb,
        driveTareLb: tractor.driveTareLb,
        wheelbaseFt: tractor.wheelbaseFt,
        fifthWheelAheadOfDriveFt: tractor.fifthWheelAheadOfDriveFt,
        bumperToSteerIn: tractor.bumperToSteerIn,
        widthIn: tractor.widthIn,
        heightIn: tractor.heightIn,
        driveAxleOffsetsFt: tractor.driveAxleOffsetsFt,
      },
      trailer: {
        tareLb: trailer.tareLb,
        tareCgFromKingpinFt: trailer.tareCgFromKingpinFt,
        axleGroupFromKingpinFt: f.sliderSettingFt ?? trailer.axleGroupFromKingpinFt,
        axleOffsetsFt: trailer.axleOffsetsFt,
        kingpinFromFrontIn: trailer.kingpinFromFrontIn,
        lengthIn: trailer.lengthIn,
        widthIn: trailer.widthIn,
        ...(trailer.heightIn ? { heightIn: trailer.heightIn } : {}),
        decks: trailer.decks,
        ...(trailer.slider ? { slider: trailer.slider } : {}),
      },
      articles,
      route: f.route.map((s) => ({ jurisdiction: s.jurisdiction, miles: s.miles, roadType: s.roadType, urban: !!s.urban, lat: s.lat, lon: s.lon, timeZone: s.timeZone })),
      travelDates: travelDates(f.requestedDeparture, f.travelDays),
      rules,
    };
  }

  toDto(moveId: string, moveVersion: number, a: { result: PlanCheckResult; ruleVersions: Record<string, number> }, now: Date): AssessmentDto {
    return { moveId, moveVersion, computedAt: now.toISOString(), ruleVersions: a.ruleVersions, pinned: false, newerRules: [], result: a.result, caution: PLANNING_CAUTION };
  }
}

export function summarize(r: PlanCheckResult): MoveSummary {
  return {
    permitsNeeded: r.summary.permitsNeeded,
    escorts: r.summary.maxEscortsFront + r.summary.maxEscortsRear,
    superload: r.summary.superloads.length > 0,
    overweight: r.jurisdictions.some((j) => j.overweight),
    problems: r.summary.problems,
    estimatedFeesUsd: r.summary.estimatedFeesUsd,
  };
}
