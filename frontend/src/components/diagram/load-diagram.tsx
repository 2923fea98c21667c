import { useEffect, useMemo, useRef, useState } from 'react';
import type { DimensionsResult, MarkingsResult } from '@amberline/common';
import { geometry, type DiagramPlan } from './load-geometry';
import { RearView, SideView, TopView } from './load-views';
import { PALETTE, SIDE_MAX_PX } from './palette';
import { placeMarkings } from './placement';

export type { DiagramArticle, DiagramPlan, DiagramTractor, DiagramTrailer } from './load-geometry';

export type LoadDiagramProps = {
  plan: DiagramPlan;
  /** The plan check's dimensions and markings; without it the drawing measures the plan itself and shows no markings. */
  result?: { dimensions: DimensionsResult; markings: MarkingsResult } | null;
  /** Markings to draw instead of the result's own (e.g. one jurisdiction's). */
  markings?: MarkingsResult | null;
  views?: ('side' | 'top' | 'rear')[];
};

/**
 * Side, top and rear views of this load on this trailer, drawn to scale from the data: the tractor outline, the deck
 * sections at their heights, each piece at its placement with its dunnage, overall dimensions and overhangs, and the
 * flags, signs and lamps of the markings in their places.
 */
export function LoadDiagram({ plan, result, markings: markingsOverride, views = ['side', 'top', 'rear'] }: LoadDiagramProps) {
  // the drawn width, so that labels stay readable on a phone
  const box = useRef<HTMLDivElement>(null);
  const [px, setPx] = useState(900);
  useEffect(() => {
    const el = box.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(([e]) => setPx(Math.max(200, Math.min(SIDE_MAX_PX, e.contentRect.width))));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const g = useMemo(() => {
    try {
      return geometry(plan, result?.dimensions);
    } catch (e) {
      return e as Error;
    }
  }, [plan, result?.dimensions]);
  if (g instanceof Error) {
    return (
      <div data-testid="load-diagram" style={{ color: PALETTE.muted }}>
        The drawing needs a complete placement: {g.message}
      </div>
    );
  }
  const markings = markingsOverride ?? result?.markings ?? null;
  const d = g.dims;
  const projecting = [...(d.sideProjectionLeftIn > 0 ? (['left'] as const) : []), ...(d.sideProjectionRightIn > 0 ? (['right'] as const) : [])];
  const marks = markings ? placeMarkings(markings, g.articles, projecting) : [];
  return (
    <div data-testid="load-diagram" ref={box}>
      {views.includes('side') && <SideView plan={plan} g={g} marks={marks} px={px} />}
      {views.includes('top') && <TopView plan={plan} g={g} marks={marks} px={px} />}
      {views.includes('rear') && <RearView plan={plan} g={g} marks={marks} px={Math.min(px, 520)} />}
      {markings && <MarkingsLegend markings={markings} />}
    </div>
  );
}

function MarkingsLegend({ markings }: { markings: MarkingsResult }) {
  const items = [
    ...markings.signs.map((s) => ({ kind: 'sign', text: `${s.text} sign, ${s.minWidthIn}×${s.minHeightIn} in, ${s.colors} — ${s.position}`, reason: s.reason, source: s.source })),
    ...markings.escortSigns.map((s) => ({ kind: 'sign', text: `${s.text} sign, ${s.minWidthIn}×${s.minHeightIn} in — ${s.position}`, reason: s.reason, source: s.source })),
    ...markings.flags.map((f) => ({ kind: 'flag', text: `flag ${f.minSquareIn}×${f.minSquareIn} in, ${f.colors} — ${f.position}`, reason: f.reason, source: f.source })),
    ...markings.lamps.map((l) => ({ kind: l.color === 'red' ? 'lamp-red' : 'lamp-amber', text: `${l.count} ${l.color} lamp${l.count === 1 ? '' : 's'} — ${l.position}`, reason: l.reason, source: l.source })),
    ...markings.reflectors.map((r) => ({ kind: r.color === 'red' ? 'lamp-red' : 'lamp-amber', text: `${r.count} ${r.color} reflector${r.count === 1 ? '' : 's'} — ${r.position}`, reason: '', source: r.source })),
  ];
  if (items.length === 0) return <p style={{ fontSize: 12, color: PALETTE.muted }}>No flags, signs or lamps asked for.</p>;
  const swatch = (k: string) =>
    k === 'sign' ? <rect x={1} y={3} width={14} height={8} fill={PALETTE.sign} stroke={PALETTE.ink} /> : k === 'flag' ? <polygon points="2,2 14,7 2,12" fill={PALETTE.flag} stroke={PALETTE.ink} /> : <circle cx={7} cy={7} r={5} fill={k === 'lamp-red' ? PALETTE.red : PALETTE.amber} stroke={PALETTE.ink} />;
  return (
    <ul style={{ listStyle: 'none', padding: 0, margin: 0, fontSize: 12 }} data-testid="markings-legend">
      {items.map((i, n) => (
        <li key={n} style={{ display: 'flex', gap: 6, alignItems: 'flex-start', marginBottom: 4 }}>
          <svg width={16} height={14} style={{ flex: 'none', marginTop: 2 }}>
            {swatch(i.kind)}
          </svg>
          <span>
            {i.text}
            {i.reason && <span style={{ color: PALETTE.muted }}> ({i.reason})</span>}
            <span style={{ color: PALETTE.muted }}> · {i.source}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}
