/**
 * The last day a permit can be filed with the state and still be issued for the move's departure: the requested
 * departure less the state's lead time, in calendar days. A lead time not on file is kept as 0 (file by the
 * departure at the latest). Dates are `YYYY-MM-DD`; the result is one too.
 */
export function fileByDate(departure: string, leadTimeDays: number): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(departure);
  if (!m) throw new RangeError(`departure must be a date YYYY-MM-DD, not ${departure}`);
  if (!Number.isInteger(leadTimeDays) || leadTimeDays < 0) throw new RangeError(`leadTimeDays must be a whole number of days, 0 or more, not ${leadTimeDays}`);
  const day = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
  return new Date(day - leadTimeDays * 86_400_000).toISOString().slice(0, 10);
}

/** True when the file-by date has passed on `today` (a local `YYYY-MM-DD` in the permit's state). */
export const pastFileBy = (fileBy: string, today: string): boolean => fileBy < today;
