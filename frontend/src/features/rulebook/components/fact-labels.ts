/** Labels and plain-language values for the facts of a rule record, shared by the view, the editor and the diff. */
import { formatFeetInches, formatPounds } from '@amberline/common';

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

const DAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const off = (m: number, what: string) => (m === 0 ? what : `${Math.abs(m)} min ${m < 0 ? 'before' : 'after'} ${what}`);

/** A known value in words; "no limit set" for a sourced null; JSON for the rest. */
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
    return `${off(d.startOffsetMin, 'sunrise')} to ${off(d.endOffsetMin, 'sunset')}${d.appliesAbove ? ` for loads over ${JSON.stringify(d.appliesAbove)}` : ''}`;
  }
  if (path === 'travel.weekends' && typeof value === 'object') {
    const w = value as { bans: { day: number; from?: string; to?: string }[] };
    return w.bans.length === 0 ? 'weekend travel allowed' : `no travel: ${w.bans.map((b) => `${DAYS[b.day]}${b.from || b.to ? ` ${b.from ?? '00:00'}–${b.to ?? '24:00'}` : ''}`).join(', ')}`;
  }
  if (path === 'travel.holidays' && typeof value === 'object') {
    const h = value as { names: string[]; from: string; observance: string };
    return h.names.length === 0 ? 'no holiday limit' : `${h.names.join(', ')}; from ${h.from.replace(/-/g, ' ')}; ${h.observance} date`;
  }
  if (path === 'travel.curfews' && Array.isArray(value)) {
    return value.length === 0 ? 'no curfews' : value.map((c: { area: string; start: string; end: string }) => `${c.area} ${c.start}–${c.end}`).join('; ');
  }
  return JSON.stringify(value);
}
