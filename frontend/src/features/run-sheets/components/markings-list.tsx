import { Typography } from 'antd';
import type { MarkingsResult } from '@amberline/common';
import { CitedSource } from '../../../components/rule-source';

type Item = { kind: 'flag' | 'sign' | 'lamp-red' | 'lamp-amber'; what: string; where: string; reason: string; source: string };

function Swatch({ kind }: { kind: Item['kind'] }) {
  return (
    <svg width={18} height={16} style={{ flex: 'none', marginTop: 3 }} aria-hidden>
      {kind === 'sign' ? (
        <rect x={1} y={4} width={16} height={9} fill="#facc15" stroke="#0f172a" />
      ) : kind === 'flag' ? (
        <polygon points="2,2 16,8 2,14" fill="#ea580c" stroke="#0f172a" />
      ) : (
        <circle cx={8} cy={8} r={6} fill={kind === 'lamp-red' ? '#dc2626' : '#f59e0b'} stroke="#0f172a" />
      )}
    </svg>
  );
}

/** Every flag, sign, lamp and reflector with its place, its rule and its source. */
export function MarkingsList({ markings }: { markings: MarkingsResult }) {
  const items: Item[] = [
    ...markings.flags.map((f) => ({ kind: 'flag' as const, what: `Flag, ${f.minSquareIn}×${f.minSquareIn} in, ${f.colors}`, where: f.position, reason: f.reason, source: f.source })),
    ...markings.signs.map((s) => ({
      kind: 'sign' as const,
      what: `"${s.text}" sign, ${s.minWidthIn}×${s.minHeightIn} in, letters ${s.letterHeightIn} in, ${s.colors}`,
      where: s.position,
      reason: s.reason,
      source: s.source,
    })),
    ...markings.escortSigns.map((s) => ({ kind: 'sign' as const, what: `"${s.text}" sign, ${s.minWidthIn}×${s.minHeightIn} in`, where: s.position, reason: s.reason, source: s.source })),
    ...markings.lamps.map((l) => ({
      kind: l.color === 'red' ? ('lamp-red' as const) : ('lamp-amber' as const),
      what: `${l.count} ${l.color} lamp${l.count === 1 ? '' : 's'}${l.visibleFt ? `, visible ${l.visibleFt} ft` : ''}`,
      where: l.position,
      reason: l.reason,
      source: l.source,
    })),
    ...markings.reflectors.map((r) => ({
      kind: r.color === 'red' ? ('lamp-red' as const) : ('lamp-amber' as const),
      what: `${r.count} ${r.color} reflector${r.count === 1 ? '' : 's'}`,
      where: r.position,
      reason: '',
      source: r.source,
    })),
  ];
  if (items.length === 0) return <Typography.Text type="secondary">No flags, signs or lamps are asked for on this load.</Typography.Text>;
  return (
    <ul style={{ listStyle: 'none', padding: 0, margin: 0 }} data-testid="markings-list">
      {items.map((i, n) => (
        <li key={n} style={{ display: 'flex', gap: 8, padding: '6px 0', borderTop: n ? '1px solid #f1f5f9' : undefined }} data-testid={`marking-${i.kind.startsWith('lamp') ? 'lamp' : i.kind}`}>
          <Swatch kind={i.kind} />
          <div style={{ minWidth: 0, fontSize: 13 }}>
            <div style={{ fontWeight: 600 }}>{i.where.charAt(0).toUpperCase() + i.where.slice(1)}</div>
            <div>{i.what}</div>
            {i.reason && <div style={{ color: '#475569' }}>{i.reason}</div>}
            <CitedSource text={i.source} />
          </div>
        </li>
      ))}
    </ul>
  );
}
