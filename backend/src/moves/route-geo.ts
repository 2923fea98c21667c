import * as zipcodes from 'zipcodes';
import { jurisdictionByCode, type RouteSegmentDto, type RouteSegmentInput } from '@amberline/common';
import { fieldError } from '../core/app-exception';

const centers = new Map<string, { lat: number; lon: number }>();

/** The mean position of a state's ZIP codes: a stand-in point when the dispatcher gives none. */
function stateCenter(code: string): { lat: number; lon: number } | null {
  const hit = centers.get(code);
  if (hit) return hit;
  const all = (zipcodes.lookupByState(code) ?? []) as zipcodes.ZipCode[];
  if (!all.length) return null;
  const c = { lat: all.reduce((s, z) => s + z.latitude, 0) / all.length, lon: all.reduce((s, z) => s + z.longitude, 0) / all.length };
  centers.set(code, c);
  return c;
}

/** Checks the route's order and jurisdictions and gives every segment a point and a time zone. */
export function resolveRoute(route: RouteSegmentInput[]): RouteSegmentDto[] {
  const orders = route.map((s) => s.order).sort((a, b) => a - b);
  orders.forEach((o, i) => {
    if (o !== i + 1) {
      throw fieldError('route', orders.indexOf(o) !== i ? `segment order ${o} is repeated` : `segment orders must run 1..${route.length} with none missing`);
    }
  });
  return [...route]
    .sort((a, b) => a.order - b.order)
    .map((s) => {
      const i = route.indexOf(s);
      const j = jurisdictionByCode(s.jurisdiction);
      if (!j) throw fieldError(`route[${i}].jurisdiction`, `${s.jurisdiction} is not one of the 48 contiguous states or DC`);
      let lat = s.lat;
      let lon = s.lon;
      let place: string | null = null;
      if (s.zip) {
        const z = zipcodes.lookup(s.zip);
        if (!z) throw fieldError(`route[${i}].zip`, `${s.zip} is not a known ZIP code`);
        if (z.state !== s.jurisdiction) throw fieldError(`route[${i}].zip`, `${s.zip} is in ${z.state}, not ${s.jurisdiction}`);
        lat = z.latitude;
        lon = z.longitude;
        place = `${z.city}, ${z.state} ${s.zip}`;
      }
      if ((lat === undefined) !== (lon === undefined)) throw fieldError(`route[${i}].lat`, 'give both lat and lon, or a ZIP code');
      if (lat === undefined || lon === undefined) {
        const c = stateCenter(s.jurisdiction)!;
        lat = Math.round(c.lat * 1000) / 1000;
        lon = Math.round(c.lon * 1000) / 1000;
        place = `${j.name} (center of the state)`;
      }
      const out: RouteSegmentDto = { ...s, lat, lon, timeZone: j.timeZone, place };
      if (out.zip === undefined) delete out.zip;
      return out;
    });
}
