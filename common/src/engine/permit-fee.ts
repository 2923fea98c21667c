/** Permit fee estimate from a rulebook fee formula. */
import { FeeRule } from './jurisdiction-rule';
import { RULEBOOK_CAUTION } from './reasons';
import { formatFeetInches, formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type FeeMove = {
  grossLb: number;
  widthIn: number;
  heightIn: number;
  lengthIn: number;
  /** Miles travelled in this jurisdiction. */
  miles: number;
  /** Registered gross weight (defaults to 80,000 lb). */
  registeredGrossLb?: number;
  oversize: boolean;
  overweight: boolean;
};

export type FeeLine = { label: string; amountUsd: number; reason: string; source: string };

export type FeeEstimate = { known: true; totalUsd: number; lines: FeeLine[]; refundable: boolean | null; caution: string };
/** A fee the rulebook has not on file: unknown, never $0. */
export type FeeNotOnFile = { known: false; totalUsd: null; message: string };

const cents = (usd: number): number => Math.round(usd * 100);

/** Flat base, width tiers, dimension tiers, weight brackets, per ton-mile over a threshold and add-ons. */
export function estimatePermitFee(fee: FeeRule, move: FeeMove, source: string): FeeEstimate {
  const gross = checkNumber('grossLb', move.grossLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  const width = checkNumber('widthIn', move.widthIn, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  const height = checkNumber('heightIn', move.heightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' });
  const length = checkNumber('lengthIn', move.lengthIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  const miles = checkNumber('miles', move.miles, { min: 0, max: ABSURD.miles });
  const registered = checkNumber('registeredGrossLb', move.registeredGrossLb ?? 80_000, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
  const src = source;
  const lines: FeeLine[] = [];
  const add = (label: string, usd: number, reason: string): void => {
    lines.push({ label, amountUsd: cents(usd) / 100, reason, source: src });
  };

  if (fee.baseUsd > 0) add('base permit fee', fee.baseUsd, 'flat fee per permit');
  if (fee.widthTiers && fee.widthTiers.length > 0) {
    const tier = fee.widthTiers.find((t) => t.upToIn === undefined || width <= t.upToIn) ?? fee.widthTiers[fee.widthTiers.length - 1];
    add('width tier', tier.feeUsd, tier.upToIn === undefined ? `width ${formatFeetInches(width)} above the last tier` : `width ${formatFeetInches(width)} up to ${formatFeetInches(tier.upToIn)}`);
  }
  const dimensionPart = move.oversize && !(move.overweight && fee.combined === 'weight-only');
  if (dimensionPart && fee.dimensionTiers && fee.dimensionTiers.length > 0) {
    const fits = (t: (typeof fee.dimensionTiers)[number]): boolean =>
      (t.maxWidthIn === undefined || width <= t.maxWidthIn) &&
      (t.maxHeightIn === undefined || height <= t.maxHeightIn) &&
      (t.maxLengthIn === undefined || length <= t.maxLengthIn);
    const tier = fee.dimensionTiers.find(fits) ?? fee.dimensionTiers[fee.dimensionTiers.length - 1];
    add('dimension fee', tier.feeUsd, `oversize: ${formatFeetInches(width)} wide, ${formatFeetInches(height)} high`);
  }
  if (move.overweight && fee.weightBrackets) {
    const b = fee.weightBrackets.find((w) => gross > w.overLb && (w.upToLb === undefined || gross <= w.upToLb));
    if (b) add('weight fee', b.feeUsd, `gross ${formatPounds(gross)} over ${formatPounds(b.overLb)}${b.upToLb ? ` up to ${formatPounds(b.upToLb)}` : ''}`);
  }
  if (move.overweight && fee.tonMile) {
    const tm = fee.tonMile;
    const threshold = tm.overRegisteredGross ? registered : (tm.overLb ?? 80_000);
    const appliesAbove = tm.appliesAboveLb ?? threshold;
    if (gross > appliesAbove && gross > threshold) {
      const tons = (gross - threshold) / 2000;
      add(
        'ton-mile fee',
        tons * miles * tm.usdPerTonMile,
        `${Math.round(tons * 100) / 100} tons over ${formatPounds(threshold)} × ${miles} mi × $${tm.usdPerTonMile} per ton-mile`,
      );
    }
  }
  if (fee.perMile) {
    const when = fee.perMile.when ?? 'always';
    if (when === 'always' || (when === 'oversize' && move.oversize) || (when === 'overweight' && move.overweight)) {
      add('mileage fee', miles * fee.perMile.usdPerMile, `${miles} mi × $${fee.perMile.usdPerMile} per mile`);
    }
  }
  for (const a of fee.addOns ?? []) {
    const when = a.when ?? 'always';
    if (when === 'always' || (when === 'oversize' && move.oversize) || (when === 'overweight' && move.overweight)) add(a.label, a.feeUsd, when === 'always' ? 'per permit' : `${when} moves`);
  }
  const totalUsd = lines.reduce((s, l) => s + cents(l.amountUsd), 0) / 100;
  return { known: true, totalUsd, lines, refundable: fee.refundable ?? null, caution: RULEBOOK_CAUTION };
}
