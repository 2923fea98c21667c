import { Tag, Typography } from 'antd';
import { JURISDICTIONS, type RouteSegmentDto } from '@amberline/common';
import { RouteMap } from '../../../components/route-map';

const ROAD_LABELS: Record<string, string> = { 'two-lane': 'two-lane', multilane: 'multilane', interstate: 'interstate' };
/** "Eastern Standard Time" rather than an IANA zone id, for the driver. */
const zoneName = (timeZone: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'long' }).formatToParts(new Date()).find((p) => p.type === 'timeZoneName')?.value ?? timeZone;
const stateName = (code: string) => JURISDICTIONS.find((j) => j.code === code)?.name ?? code;
const STRIP_COLORS = ['#fde68a', '#bfdbfe', '#bbf7d0', '#fecaca', '#ddd6fe', '#fed7aa'];

/**
 * The states crossed, in order, as a strip whose widths follow the miles, with each segment's point on it
 * (beside the map, it reads at a glance on a phone).
 */
export function RouteStrip({ route }: { route: RouteSegmentDto[] }) {
  const segs = [...route].sort((a, b) => a.order - b.order);
  const total = segs.reduce((n, s) => n + s.miles, 0) || 1;
  const runs: { code: string; miles: number; start: number }[] = [];
  let at = 0;
  for (const s of segs) {
    const last = runs[runs.length - 1];
    if (last && last.code === s.jurisdiction) last.miles += s.miles;
    else runs.push({ code: s.jurisdiction, miles: s.miles, start: at });
    at += s.miles;
  }
  const W = 1000;
  const x = (mi: number) => (mi / total) * W;
  let cum = 0;
  const points = segs.map((s) => {
    const mid = cum + s.miles / 2;
    cum += s.miles;
    return { s, x: x(mid) };
  });
  return (
    <svg viewBox={`0 0 ${W} 150`} width="100%" role="img" aria-label="States on the route, in order" data-testid="route-strip" style={{ display: 'block', marginBottom: 8 }}>
      {runs.map((r, i) => (
        <g key={`${r.code}${i}`}>
          <rect x={x(r.start)} y={46} width={Math.max(2, x(r.miles))} height={52} fill={STRIP_COLORS[i % STRIP_COLORS.length]} stroke="#475569" strokeWidth={2} />
          <text x={x(r.start) + x(r.miles) / 2} y={36} fontSize={38} fontWeight={700} textAnchor="middle" fill="#0f172a">
            {r.code}
          </text>
        </g>
      ))}
      <line x1={points[0]?.x ?? 0} x2={points[points.length - 1]?.x ?? 0} y1={72} y2={72} stroke="#0f172a" strokeWidth={5} />
      {points.map(({ s, x: px }) => (
        <g key={s.order}>
          <title>{`${s.order}. ${s.roads} — ${s.miles} mi${s.place ? `, near ${s.place}` : ''} (${s.lat.toFixed(3)}, ${s.lon.toFixed(3)})`}</title>
          <circle cx={px} cy={72} r={22} fill="#fff" stroke="#0f172a" strokeWidth={5} />
          <text x={px} y={73} fontSize={28} fontWeight={700} textAnchor="middle" dominantBaseline="central">
            {s.order}
          </text>
        </g>
      ))}
      <text x={0} y={140} fontSize={32} fill="#64748b">
        start
      </text>
      <text x={W} y={140} fontSize={32} fill="#64748b" textAnchor="end">
        {`${Math.round(total)} mi`}
      </text>
    </svg>
  );
}

export function RouteSection({ route }: { route: RouteSegmentDto[] }) {
  const segs = [...route].sort((a, b) => a.order - b.order);
  return (
    <>
      <RouteMap points={segs.map((s) => ({ order: s.order, jurisdiction: s.jurisdiction, lat: s.lat, lon: s.lon }))} height={220} />
      <RouteStrip route={segs} />
      <ol style={{ listStyle: 'none', padding: 0, margin: 0 }} data-testid="route-segments">
        {segs.map((s) => (
          <li key={s.order} style={{ display: 'flex', gap: 10, padding: '6px 0', borderTop: '1px solid #f1f5f9' }}>
            <span style={{ flex: 'none', width: 24, height: 24, borderRadius: 12, border: '2px solid #0f172a', textAlign: 'center', lineHeight: '20px', fontWeight: 700, fontSize: 12 }}>
              {s.order}
            </span>
            <div style={{ minWidth: 0 }}>
              <div style={{ fontWeight: 600, overflowWrap: 'anywhere' }}>{s.roads}</div>
              <Typography.Text type="secondary" style={{ fontSize: 13 }}>
                {stateName(s.jurisdiction)} · {s.miles} mi · {ROAD_LABELS[s.roadType] ?? s.roadType}
                {s.urban ? ' · in town' : ''}
                {s.place ? ` · near ${s.place}` : ''}
              </Typography.Text>
              <div>
                <Tag style={{ fontSize: 11, marginTop: 2 }} title={s.timeZone}>{zoneName(s.timeZone)}</Tag>
              </div>
            </div>
          </li>
        ))}
      </ol>
    </>
  );
}
