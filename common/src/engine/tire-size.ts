/** Tire size notation: the nominal section width the per-inch-of-tire-width rules are read against. */

export type TireSize = {
  /** The size as given, trimmed. */
  size: string;
  /** Nominal section width, inches (metric sizes converted at 25.4 mm to the inch). */
  sectionWidthIn: number;
  /** Rim diameter, inches. */
  rimDiameterIn: number;
  /** Aspect ratio (section height as a percentage of width), when the size states one. */
  aspectRatio: number | null;
  notation: 'metric' | 'inch';
};

const MM_PER_IN = 25.4;

/**
 * Reads a truck tire size. Metric "425/65R22.5" (section width 425 mm ≈ 16.73 in, aspect 65, 22.5 in rim),
 * inch "11R22.5" or "11-22.5" (11 in nominal section width), "10.00R20", with optional load-range or service
 * marks after the size ("275/80R22.5 144/141L" reads as 275/80R22.5). Throws a RangeError for anything else.
 */
export function parseTireSize(size: string): TireSize {
  if (typeof size !== 'string' || size.trim() === '') throw new RangeError('tire size must be a size such as 11R22.5 or 425/65R22.5');
  const s = size.trim().toUpperCase();
  const metric = /^(?:LT|ST)?(\d{3})\s*\/\s*(\d{2})\s*[RB-]?\s*(\d{2}(?:\.\d)?)(?:\s.*)?$/.exec(s);
  if (metric) {
    const mm = Number(metric[1]);
    return { size: size.trim(), sectionWidthIn: mm / MM_PER_IN, rimDiameterIn: Number(metric[3]), aspectRatio: Number(metric[2]), notation: 'metric' };
  }
  const inch = /^(\d{1,2}(?:\.\d{1,2})?)\s*[R-]\s*(\d{2}(?:\.\d)?)(?:\s.*)?$/.exec(s);
  if (inch) {
    const w = Number(inch[1]);
    const rim = Number(inch[2]);
    if (w >= 4 && w <= 30 && rim >= 12 && rim <= 30) return { size: size.trim(), sectionWidthIn: w, rimDiameterIn: rim, aspectRatio: null, notation: 'inch' };
  }
  throw new RangeError(`tire size "${size}" is not a size this package reads (e.g. 11R22.5, 11-22.5, 425/65R22.5, 275/80R22.5)`);
}
