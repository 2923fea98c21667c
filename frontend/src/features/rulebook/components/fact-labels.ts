/** Labels and plain-language values for the facts of a rule record, shared by the view, the editor and the diff. */
import {
  MEASURE_LABELS, describeDaylight, describeHolidays, describeWeekends, formatFeetInches, formatPounds, formatUsd,
  type HolidayRule, type Trigger, type WeekendRule,
} from '@amberline/common';

export const FACT_LABELS: Record<string, string> = {
  'legal.widthIn': 'Legal width',
  'legal.heightIn': 'Legal height',
  'legal.overallLengthIn': 'Overall length (tractor-semitrailer)',
  'legal.semitrailerLengthIn': 'Semitrailer length',
  'legal.frontOverhangIn': 'Front overhang',
  'legal.rearOverhangIn': 'Rear overhang',
  'legal.singleAxleLb': 'Single axle',
  'legal.tandemLb': 'Tandem axle',
  'legal.tridemLb': 'Tridem axle',
  'legal.grossLb': 'Gross weight',
  'legal.bridge': 'Bridge formula',
  'legal.tireLbPerInch': 'Tire load per inch of width',
  'permit.validityDays': 'Single-trip validity',
  'permit.leadTimeDays': 'Apply ahead',
  'permit.classes': 'Permit classes',
  'permit.routineMaxima': 'Routine permit maxima',
  superload: 'Superload thresholds',
  'escorts.width': 'Escorts by width',
  'escorts.height': 'Escorts by height',
  'escorts.length': 'Escorts by length',
  'escorts.frontOverhang': 'Escorts by front overhang',
  'escorts.rearOverhang': 'Escorts by rear overhang',
  'escorts.sideProjection': 'Escorts for off-center loads',
  'escorts.twoDimensionRule': 'Over escort limits in two measures',
  'escorts.heightPoleMarginIn': 'Height pole above the load',
  'escorts.certification': 'Escort certification',
  signs: 'Signs',
  flags: 'Flags',
  lamps: 'Lamps',
  'travel.daylight': 'Travel hours',
  'travel.weekends': 'Weekends',
  'travel.holidays': 'Holidays',
  'travel.curfews': 'Curfews',
  'travel.minVisibilityFt': 'Minimum visibility',
  fee: 'Fee formula',
  speed: 'Speed',
};


/** A number named by its key's unit suffix (…In, …Lb, …Usd, …Min). */
function withUnit(key: string, v: number): string {
  if (/In$/.test(key)) return formatFeetInches(v);
  if (/Lb$/.test(key)) return formatPounds(v);
  if (/Usd$/.test(key)) return formatUsd(v);
  if (/Min$/.test(key)) return `${v} min`;
  return String(v);
}
const words = (key: string): string => key.replace(/(In|Lb|Usd|Min)$/, '').replace(/([A-Z])/g, ' $1').toLowerCase();
/** A flat object of numbers and words, e.g. `{ widthOverIn: 192, grossOverLb: 160000 }` → "width over 16'0", gross over 160,000 lb". */
function flat(o: Record<string, unknown>): string {
  return Object.entries(o)
    .map(([k, v]) => (typeof v === 'number' ? `${words(k)} ${withUnit(k, v)}` : typeof v === 'boolean' ? (v ? words(k) : '') : Array.isArray(v) ? `${words(k)}: ${v.length}` : `${words(k)}: ${String(v)}`))
    .filter(Boolean)
    .join('; ');
}
const trig = (t: Trigger): string => `${MEASURE_LABELS[t.measure]} ${t.over !== undefined ? `over ${withUnit(t.measure === 'gross' ? 'Lb' : 'In', t.over)}` : `${withUnit(t.measure === 'gross' ? 'Lb' : 'In', t.atLeast ?? 0)} or more`}`;
const when = (ts: Trigger[], oversize?: boolean): string => [oversize ? 'oversize loads' : '', ...ts.map(trig)].filter(Boolean).join(' or ') || 'always';

/** A known value in words; "none set by the text" for a sourced null. */
export function describeValue(path: string, value: unknown): string {
  if (value === null) return path.startsWith('travel.daylight') ? 'any hour (no daylight rule)' : 'none set by the text';
  if (typeof value === 'number') {
    if (path.endsWith('In')) return formatFeetInches(value);
    if (path.endsWith('Lb') || path.endsWith('LbPerInch')) return `${formatPounds(value)}${path.endsWith('PerInch') ? ' per inch' : ''}`;
    if (path.endsWith('Days')) return `${value} days`;
    if (path.endsWith('Ft')) return `${value} ft`;
    return String(value);
  }
  if (typeof value === 'string') return value;
  if (Array.isArray(value) && value.every((x) => typeof x === 'string')) return value.length ? value.join(', ') : 'none';
  if (path === 'signs' && Array.isArray(value)) {
    return value.length === 0 ? 'no signs asked' : value.map((x: { text: string; minWidthIn: number; minHeightIn: number; letterHeightIn: number; colors: string; positions: string[]; when: Trigger[]; whenOversize?: boolean }) => `“${x.text}” ${formatFeetInches(x.minWidthIn)} × ${x.minHeightIn} in, ${x.letterHeightIn} in letters, ${x.colors}, at ${x.positions.join(' and ')} (${when(x.when, x.whenOversize)})`).join('; ');
  }
  if (path === 'flags' && Array.isArray(value)) {
    return value.length === 0 ? 'no flags asked' : value.map((x: { kind: string; minCount: number; minSquareIn: number; colors: string; when: Trigger[]; whenOversize?: boolean }) => `${x.minCount} ${x.kind.replace('-', ' ')} flag(s), ${x.minSquareIn} sq in, ${x.colors} (${when(x.when, x.whenOversize)})`).join('; ');
  }
  if (path === 'lamps' && Array.isArray(value)) {
    return value.length === 0 ? 'no lamps asked' : value.map((x: { lamps: { count: number; color: string; position: string }[]; when: Trigger[]; note?: string }) => `${x.lamps.map((l) => `${l.count} ${l.color} at ${l.position}`).join(', ')} (${when(x.when)}${x.note ? `, ${x.note}` : ''})`).join('; ');
  }
  if (Array.isArray(value) && path.startsWith('escorts.')) {
    if (value.length === 0) return 'no escorts asked by this measure';
    return value
      .map((r: { when: { over?: number; atLeast?: number; measure: string }; roads: string[]; front: number; rear: number; heightPole?: boolean; alternative?: string; police?: boolean }) => {
        const th = r.when.over !== undefined ? `over ${formatFeetInches(r.when.over)}` : `${formatFeetInches(r.when.atLeast ?? 0)} or more`;
        return `${th} on ${r.roads.join('/')}: ${r.front} front, ${r.rear} rear${r.heightPole ? ', height pole' : ''}${r.police ? ', police' : ''}${r.alternative ? ` (or ${r.alternative})` : ''}`;
      })
      .join('; ');
  }
  if (path === 'travel.daylight' && typeof value === 'object') {
    const d = value as { startOffsetMin: number; endOffsetMin: number; appliesAbove?: Record<string, number> };
    return `${describeDaylight(d)}${d.appliesAbove ? ` for loads over ${flat(d.appliesAbove)}` : ''}`;
  }
  if (path === 'travel.weekends' && typeof value === 'object') return describeWeekends(value as WeekendRule);
  if (path === 'travel.holidays' && typeof value === 'object') return describeHolidays(value as HolidayRule);
  if (path === 'travel.curfews' && Array.isArray(value)) {
    return value.length === 0 ? 'no curfews' : value.map((c: { area: string; start: string; end: string }) => `${c.area} ${c.start}–${c.end}`).join('; ');
  }
  if (path === 'legal.bridge' && typeof value === 'object') {
    const b = value as { formula: boolean; tandemPairMinFt: number | null; tie: string };
    return `${b.formula ? 'bridge formula' : 'no bridge formula'}${b.tandemPairMinFt !== null ? `; two tandems ${b.tandemPairMinFt} ft apart carry a tandem each` : ''}; ties round ${b.tie}`;
  }
  if (path === 'fee' && typeof value === 'object') {
    const f = value as Record<string, unknown> & { baseUsd: number };
    const parts = [`base ${formatUsd(f.baseUsd)}`];
    if (Array.isArray(f.widthTiers)) parts.push(`${f.widthTiers.length} width tier(s)`);
    if (Array.isArray(f.dimensionTiers)) parts.push(`${f.dimensionTiers.length} dimension tier(s)`);
    if (Array.isArray(f.weightBrackets)) parts.push(`${f.weightBrackets.length} weight bracket(s)`);
    if (f.tonMile) parts.push(`${formatUsd((f.tonMile as { usdPerTonMile: number }).usdPerTonMile)} per ton-mile`);
    if (f.perMile) parts.push(`${formatUsd((f.perMile as { usdPerMile: number }).usdPerMile)} per mile`);
    if (f.combined) parts.push(f.combined === 'weight-only' ? 'oversize and overweight: base and weight part only' : 'oversize and overweight: parts added');
    if (f.refundable !== undefined) parts.push(f.refundable ? 'refundable' : 'not refundable');
    return parts.join('; ');
  }
  if (typeof value === 'object') return flat(value as Record<string, unknown>);
  return String(value);
}
