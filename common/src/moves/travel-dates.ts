/**
 * Each calendar day of travel, `YYYY-MM-DD`, from the departure date: day 1 is the departure date itself and each
 * following day is the next calendar date (read as UTC dates, so no time zone or daylight-saving change shifts them).
 */
export function travelDates(departure: string, days: number): string[] {
  const start = Date.parse(`${departure}T00:00:00Z`);
  return Array.from({ length: days }, (_, i) => new Date(start + i * 86_400_000).toISOString().slice(0, 10));
}
