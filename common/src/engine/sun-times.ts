/** Sunrise and sunset (sun 50′ below the horizon) with suncalc. */
import { getTimes } from 'suncalc';
import { SOURCES } from './reasons';
import { checkNumber, parseIsoDate } from './validate';

export type SunTimesResult = {
  date: string;
  /** UTC instants as ISO strings; null when the sun does not rise or set that day. */
  sunrise: string | null;
  sunset: string | null;
  solarNoon: string;
  alwaysUp: boolean;
  alwaysDown: boolean;
  source: string;
};

/** Internal: epoch milliseconds for the local solar day of `y-m-d` at longitude `lon`. */
export function sunTimesMs(
  y: number,
  m: number,
  d: number,
  lat: number,
  lon: number,
): { sunrise: number | null; sunset: number | null; solarNoon: number; alwaysUp: boolean; alwaysDown: boolean } {
  // Ask for the solar day whose noon is nearest to local mean noon of that calendar date.
  const localNoonUtc = Date.UTC(y, m - 1, d, 12) - (lon / 15) * 3_600_000;
  const t = getTimes(new Date(localNoonUtc), lat, lon);
  return {
    sunrise: t.sunrise ? t.sunrise.getTime() : null,
    sunset: t.sunset ? t.sunset.getTime() : null,
    solarNoon: t.solarNoon.getTime(),
    alwaysUp: t.alwaysUp === true,
    alwaysDown: t.alwaysDown === true,
  };
}

export function checkLatLon(lat: unknown, lon: unknown): void {
  checkNumber('lat', lat, { min: -90, max: 90 });
  checkNumber('lon', lon, { min: -180, max: 180 });
}

/**
 * Sunrise and sunset for the local calendar day `date` (YYYY-MM-DD) at lat/lon (degrees, west negative),
 * as UTC instants. Sun 50′ below the horizon (NOAA/USNO convention), computed with suncalc.
 */
export function sunTimes(date: string, lat: number, lon: number): SunTimesResult {
  const { y, m, d } = parseIsoDate('date', date);
  checkLatLon(lat, lon);
  const t = sunTimesMs(y, m, d, lat, lon);
  return {
    date,
    sunrise: t.sunrise === null ? null : new Date(t.sunrise).toISOString(),
    sunset: t.sunset === null ? null : new Date(t.sunset).toISOString(),
    solarNoon: new Date(t.solarNoon).toISOString(),
    alwaysUp: t.alwaysUp,
    alwaysDown: t.alwaysDown,
    source: SOURCES.noaa,
  };
}
