import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import {
  formatFeetInches,
  overallDimensions,
  type DeckSection,
  type DimensionsResult,
  type MarkingsResult,
  type PlacedArticle,
  type TractorInput,
  type TrailerInput,
} from '@amberline/common';

export type DiagramTractor = Pick<TractorInput, 'wheelbaseFt' | 'fifthWheelAheadOfDriveFt' | 'bumperToSteerIn' | 'widthIn' | 'heightIn' | 'driveAxleOffsetsFt'>;
export type DiagramTrailer = Pick<TrailerInput, 'lengthIn' | 'widthIn' | 'decks' | 'kingpinFromFrontIn' | 'axleOffsetsFt' | 'axleGroupFromKingpinFt'> & {
  heightIn?: number | null;
};
export type DiagramArticle = PlacedArticle & { id: string; description?: string };

/** The plan facts the drawing needs: this load on this trailer behind this tractor. */
export type DiagramPlan = {
  tractor: DiagramTractor;
  trailer: DiagramTrailer;
  articles: DiagramArticle[];
  /** Trailer axle-group center behind the kingpin (sliding axle); the trailer's own setting when absent. */
  sliderSettingFt?: number | null;
};

export type LoadDiagramProps = {
  plan: DiagramPlan;
  /** The plan check's dimensions and markings; without it the drawing measures the plan itself and shows no markings. */
  result?: { dimensions: DimensionsResult; markings: MarkingsResult } | null;
  /** Markings to draw instead of the result's own (e.g. one jurisdiction's). */
  markings?: MarkingsResult | null;
  views?: ('side' | 'top' | 'rear')[];
};

const WHEEL_R = 20;
const SIDE_MAX_PX = 1000;
/** Font size in drawing units: about 1/55 of the span, never under 10 px on screen. */
const fontFor = (spanUnits: number, px: number) => Math.max(14, spanUnits / 55, (10 * spanUnits) / px);
const DECK_T = 10;
const COLORS = {
  ink: '#0f172a',
  muted: '#64748b',
  tractor: '#cbd5e1',
  trailer: '#475569',
  load: '#fbbf24',
  loadStroke: '#b45309',
  dunnage: '#92400e',
  dim: '#1d4ed8',
  flag: '#ea580c',
  sign: '#facc15',
  red: '#dc2626',
  amber: '#f59e0b',
};

type Geometry = {
  steerX: number;
  driveXs: number[];
  kingpinX: number;
  trailerFront: number;
  trailerRear: number;
  trailerAxleXs: number[];
  articles: { a: DiagramArticle; x0: number; x1: number; deck: number; bottom: number; top: number; y0: number; y1: number }[];
  xMin: number;
  xMax: number;
  topMax: number;
  dims: DimensionsResult;
};

function geometry(plan: DiagramPlan, dims: DimensionsResult | undefined): Geometry {
  const { tractor, trailer } = plan;
  const steerX = tractor.bumperToSteerIn;
  const kingpinX = steerX + (tractor.wheelbaseFt - tractor.fifthWheelAheadOfDriveFt) * 12;
  const driveXs = tractor.driveAxleOffsetsFt.map((o) => steerX + (tractor.wheelbaseFt + o) * 12);
  const trailerFront = kingpinX - trailer.kingpinFromFrontIn;
  const trailerRear = trailerFront + trailer.lengthIn;
  const group = (plan.sliderSettingFt ?? trailer.axleGroupFromKingpinFt) * 12;
  const trailerAxleXs = trailer.axleOffsetsFt.map((o) => kingpinX + group + o * 12);
  const d =
    dims ??
    overallDimensions({
      tractor: { bumperToKingpinIn: kingpinX, widthIn: tractor.widthIn, heightIn: tractor.heightIn },
      trailer: {
        kingpinFromFrontIn: trailer.kingpinFromFrontIn,
        lengthIn: trailer.lengthIn,
        widthIn: trailer.widthIn,
        decks: trailer.decks,
        ...(trailer.heightIn ? { heightIn: trailer.heightIn } : {}),
      },
      articles: plan.articles,
    });
  const articles = plan.articles.map((a, i) => {
    const deck = d.articles[i]?.deckHeightIn ?? a.deckHeightIn ?? 0;
    const bottom = deck + (a.dunnageIn ?? 0);
    const off = a.lateralOffsetIn ?? 0;
    return {
      a,
      x0: trailerFront + a.positionFromTrailerFrontIn,
      x1: trailerFront + a.positionFromTrailerFrontIn + a.lengthIn,
      deck,
      bottom,
      top: bottom + a.heightIn,
      y0: off - a.widthIn / 2,
      y1: off + a.widthIn / 2,
    };
  });
  const xMin = Math.min(0, ...articles.map((p) => p.x0));
  const xMax = Math.max(trailerRear, ...articles.map((p) => p.x1));
  const topMax = Math.max(tractor.heightIn, d.heightIn, ...articles.map((p) => p.top));
  return { steerX, driveXs, kingpinX, trailerFront, trailerRear, trailerAxleXs, articles, xMin, xMax, topMax, dims: d };
}

/** A dimension line with end ticks and its label; horizontal or vertical, in the view's own coordinates. */
function Dim({ x1, y1, x2, y2, label, fs, testId, side = 'before' }: { x1: number; y1: number; x2: number; y2: number; label: string; fs: number; testId?: string; side?: 'before' | 'after' }) {
  const vertical = Math.abs(x2 - x1) < Math.abs(y2 - y1);
  const t = fs * 0.5;
  const mx = (x1 + x2) / 2;
  const my = (y1 + y2) / 2;
  return (
    <g data-testid={testId} stroke={COLORS.dim} fill={COLORS.dim}>
      <line x1={x1} y1={y1} x2={x2} y2={y2} strokeWidth={fs * 0.08} />
      {vertical ? (
        <>
          <line x1={x1 - t} x2={x1 + t} y1={y1} y2={y1} strokeWidth={fs * 0.08} />
          <line x1={x2 - t} x2={x2 + t} y1={y2} y2={y2} strokeWidth={fs * 0.08} />
          <text x={side === 'after' ? mx + t * 1.4 : mx - t * 1.4} y={my} fontSize={fs} stroke="none" textAnchor={side === 'after' ? 'start' : 'end'} dominantBaseline="middle">
            {label}
          </text>
        </>
      ) : (
        <>
          <line x1={x1} x2={x1} y1={y1 - t} y2={y1 + t} strokeWidth={fs * 0.08} />
          <line x1={x2} x2={x2} y1={y2 - t} y2={y2 + t} strokeWidth={fs * 0.08} />
          <text x={mx} y={side === 'after' ? my + fs * 1.1 : my - fs * 0.4} fontSize={fs} stroke="none" textAnchor="middle">
            {label}
          </text>
        </>
      )}
    </g>
  );
}

function Flag({ x, y, fs, title, dir = 1 }: { x: number; y: number; fs: number; title: string; dir?: 1 | -1 }) {
  const s = fs * 0.9;
  return (
    <g data-testid="diagram-flag">
      <title>{title}</title>
      <line x1={x} y1={y} x2={x} y2={y - s * 1.6} stroke={COLORS.ink} strokeWidth={fs * 0.08} />
      <polygon points={`${x},${y - s * 1.6} ${x + dir * s},${y - s * 1.25} ${x},${y - s * 0.9}`} fill={COLORS.flag} stroke={COLORS.ink} strokeWidth={fs * 0.04} />
    </g>
  );
}

function Lamp({ x, y, fs, color, title }: { x: number; y: number; fs: number; color: 'red' | 'amber'; title: string }) {
  return (
    <circle data-testid="diagram-lamp" cx={x} cy={y} r={fs * 0.35} fill={color === 'red' ? COLORS.red : COLORS.amber} stroke={COLORS.ink} strokeWidth={fs * 0.05}>
      <title>{title}</title>
    </circle>
  );
}

function Sign({ x, y, w, h, fs, text, title }: { x: number; y: number; w: number; h: number; fs: number; text: string; title: string }) {
  return (
    <g data-testid="diagram-sign">
      <title>{title}</title>
      <rect x={x - w / 2} y={y - h / 2} width={w} height={h} fill={COLORS.sign} stroke={COLORS.ink} strokeWidth={fs * 0.06} />
      <text x={x} y={y} fontSize={Math.min(h * 0.7, fs * 0.8)} textAnchor="middle" dominantBaseline="middle" fontWeight={700} fill={COLORS.ink}>
        {text}
      </text>
    </g>
  );
}

/** Where a marking's plain-words position puts it, per view. */
type Spot = { side?: { x: number; h: number }; top?: { x: number; y: number }; rear?: { y: number; h: number } };

function markingSpots(position: string, g: Geometry, index: number): Spot[] {
  const p = position.toLowerCase();
  const arts = g.articles;
  if (arts.length === 0) return [];
  const rearmost = arts.reduce((b, a) => (a.x1 > b.x1 ? a : b));
  const frontmost = arts.reduce((b, a) => (a.x0 < b.x0 ? a : b));
  const leftmost = arts.reduce((b, a) => (a.y0 < b.y0 ? a : b));
  const rightmost = arts.reduce((b, a) => (a.y1 > b.y1 ? a : b));
  const envelope = { x0: frontmost.x0, x1: rearmost.x1, y0: leftmost.y0, y1: rightmost.y1 };
  const left = /\bleft\b/.test(p);
  const right = /\bright\b/.test(p);
  if (p.includes('side projection') || p.includes('of the projection')) {
    const spots: Spot[] = [];
    const front = p.includes('front');
    const sides = left ? ['left'] : right ? ['right'] : ['left', 'right'];
    for (const s of sides) {
      const a = s === 'left' ? leftmost : rightmost;
      const y = s === 'left' ? a.y0 : a.y1;
      spots.push({ top: { x: front ? a.x0 : a.x1, y }, rear: { y, h: a.top }, side: { x: front ? a.x0 : a.x1, h: a.top } });
    }
    return spots;
  }
  if (p.includes('corner')) {
    const x = p.includes('front') ? envelope.x0 : envelope.x1;
    const y = left ? envelope.y0 : envelope.y1;
    const a = p.includes('front') ? frontmost : rearmost;
    return [{ top: { x, y }, side: { x, h: a.top }, rear: { y, h: a.top } }];
  }
  if (p.includes('widest')) {
    const y = index % 2 === 0 ? envelope.y0 : envelope.y1;
    const a = index % 2 === 0 ? leftmost : rightmost;
    return [{ top: { x: (a.x0 + a.x1) / 2, y }, rear: { y, h: a.top } }];
  }
  if (p.includes('overhang')) {
    return [{ side: { x: rearmost.x1, h: rearmost.top }, top: { x: rearmost.x1, y: 0 } }];
  }
  if (p.includes('rear') && (p.includes('load') || p.includes('vehicle'))) {
    const y = left ? rearmost.y0 : right ? rearmost.y1 : (rearmost.y0 + rearmost.y1) / 2;
    return [{ side: { x: Math.max(rearmost.x1, g.trailerRear), h: p.includes('load') ? rearmost.top : rearmost.deck }, top: { x: Math.max(rearmost.x1, g.trailerRear), y }, rear: { y, h: rearmost.top } }];
  }
  if (p.includes('front')) {
    return [{ side: { x: Math.min(0, frontmost.x0), h: 60 } }];
  }
  return [];
}

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
      <div data-testid="load-diagram" style={{ color: COLORS.muted }}>
        The drawing needs a complete placement: {g.message}
      </div>
    );
  }
  const markings = markingsOverride ?? result?.markings ?? null;
  return (
    <div data-testid="load-diagram" ref={box}>
      {views.includes('side') && <SideView plan={plan} g={g} markings={markings} px={px} />}
      {views.includes('top') && <TopView plan={plan} g={g} markings={markings} px={px} />}
      {views.includes('rear') && <RearView plan={plan} g={g} markings={markings} px={Math.min(px, 520)} />}
      {markings && <MarkingsLegend markings={markings} />}
    </div>
  );
}

function ViewFrame({ title, viewBox, children, testId, maxWidth }: { title: string; viewBox: string; children: ReactNode; testId: string; maxWidth?: number }) {
  return (
    <figure style={{ margin: '0 0 12px' }}>
      <figcaption style={{ fontSize: 12, color: COLORS.muted, marginBottom: 2 }}>{title}</figcaption>
      <svg viewBox={viewBox} width="100%" style={{ display: 'block', maxWidth, background: '#fff', border: '1px solid #e2e8f0', borderRadius: 4 }} role="img" aria-label={title} data-testid={testId}>
        {children}
      </svg>
    </figure>
  );
}

function SideView({ plan, g, markings, px }: { plan: DiagramPlan; g: Geometry; markings: MarkingsResult | null; px: number }) {
  const { tractor, trailer } = plan;
  const span = g.xMax - g.xMin;
  const fs = fontFor(span * 1.15, px);
  const padL = fs * 2;
  const padR = fs * 7;
  const padTop = fs * 4.5;
  const padBottom = fs * 4;
  const H = g.topMax;
  const y = (h: number) => H - h; // height above the road → svg y
  const vbX = g.xMin - padL;
  const vbW = span + padL + padR;
  const d = g.dims;
  const hoodEnd = g.steerX + 36;
  const cabEnd = Math.min(hoodEnd + 84, g.kingpinX - 24);
  const th = tractor.heightIn;
  const cab = [
    [0, 24],
    [0, th * 0.52],
    [hoodEnd - 10, th * 0.58],
    [hoodEnd, th * 0.8],
    [cabEnd, th * 0.8],
    [cabEnd, 36],
  ]
    .map(([x, h]) => `${x},${y(h)}`)
    .join(' ');
  const decks = [...trailer.decks].sort((a, b) => a.fromFrontIn - b.fromFrontIn);
  const deckLevel = (x: number) => decks.find((s) => g.trailerFront + s.fromFrontIn <= x && x <= g.trailerFront + s.toFrontIn)?.heightIn;
  const flagsAndLamps: ReactNode[] = [];
  if (markings) {
    markings.flags.forEach((f, i) =>
      markingSpots(f.position, g, i).forEach((s, k) => s.side && flagsAndLamps.push(<Flag key={`f${i}-${k}`} x={s.side.x} y={y(s.side.h)} fs={fs} dir={s.side.x < g.kingpinX ? -1 : 1} title={`Flag: ${f.position} — ${f.reason}`} />)),
    );
    markings.lamps.forEach((l, i) =>
      markingSpots(l.position, g, i).forEach((s, k) => s.side && flagsAndLamps.push(<Lamp key={`l${i}-${k}`} x={s.side.x} y={y(s.side.h) + fs * 0.6} fs={fs} color={l.color} title={`Lamp (${l.color}): ${l.position} — ${l.reason}`} />)),
    );
    markings.signs.forEach((sg, i) => {
      const p = sg.position.toLowerCase();
      const front = p.includes('front');
      const x = front ? Math.min(0, g.xMin) - fs * 0.2 : g.xMax + fs * 0.2;
      flagsAndLamps.push(
        <g key={`s${i}`} data-testid="diagram-sign">
          <title>{`Sign "${sg.text}": ${sg.position} — ${sg.reason}`}</title>
          <rect x={front ? x - fs * 0.5 : x} y={y(sg.minHeightIn + 40)} width={fs * 0.5} height={sg.minHeightIn} fill={COLORS.sign} stroke={COLORS.ink} strokeWidth={fs * 0.05} />
        </g>,
      );
    });
  }
  return (
    <ViewFrame title="Side view (driver's side, front to the left)" viewBox={`${vbX} ${-padTop} ${vbW} ${H + padTop + padBottom}`} testId="diagram-side" maxWidth={SIDE_MAX_PX}>
      {/* road */}
      <line x1={vbX} x2={vbX + vbW} y1={y(0)} y2={y(0)} stroke={COLORS.muted} strokeWidth={fs * 0.1} />
      {/* tractor: frame, cab, stack, fifth wheel */}
      <rect x={0} y={y(44)} width={Math.max(...g.driveXs) + 36} height={12} fill={COLORS.tractor} stroke={COLORS.ink} strokeWidth={fs * 0.06} />
      <polygon points={cab} fill={COLORS.tractor} stroke={COLORS.ink} strokeWidth={fs * 0.08} data-testid="diagram-tractor" />
      <rect x={cabEnd - 2} y={y(th)} width={6} height={th - th * 0.8} fill={COLORS.muted} />
      <rect x={g.kingpinX - 18} y={y(52)} width={36} height={8} fill={COLORS.ink} />
      {[g.steerX, ...g.driveXs].map((x, i) => (
        <circle key={`tw${i}`} cx={x} cy={y(WHEEL_R)} r={WHEEL_R} fill="#1e293b" />
      ))}
      {/* trailer decks at their heights, with the steps between them */}
      {decks.map((s, i) => {
        const x0 = g.trailerFront + s.fromFrontIn;
        const x1 = g.trailerFront + s.toFrontIn;
        const next = decks[i + 1];
        return (
          <g key={s.name + i} data-testid="diagram-deck">
            <title>{`${s.name}: ${formatFeetInches(s.heightIn)} above the road`}</title>
            <rect x={x0} y={y(s.heightIn)} width={x1 - x0} height={DECK_T} fill={COLORS.trailer} />
            {next && next.heightIn !== s.heightIn && (
              <line x1={x1} x2={x1} y1={y(s.heightIn)} y2={y(next.heightIn) + DECK_T} stroke={COLORS.trailer} strokeWidth={DECK_T * 0.8} />
            )}
          </g>
        );
      })}
      {trailer.heightIn ? <rect x={g.trailerFront} y={y(trailer.heightIn)} width={8} height={trailer.heightIn - (decks[0]?.heightIn ?? 0)} fill={COLORS.trailer} /> : null}
      {g.trailerAxleXs.map((x, i) => {
        const deckH = deckLevel(x) ?? decks[decks.length - 1]?.heightIn ?? 40;
        return (
          <g key={`rw${i}`}>
            <line x1={x} x2={x} y1={y(deckH)} y2={y(WHEEL_R)} stroke={COLORS.trailer} strokeWidth={6} />
            <circle cx={x} cy={y(WHEEL_R)} r={WHEEL_R} fill="#1e293b" data-testid="diagram-trailer-axle" />
          </g>
        );
      })}
      {/* load pieces with dunnage */}
      {g.articles.map((p) => (
        <g key={p.a.id} data-testid="diagram-piece">
          <title>{`${p.a.id}${p.a.description ? ` (${p.a.description})` : ''}: ${formatFeetInches(p.a.lengthIn)} × ${formatFeetInches(p.a.widthIn)} × ${formatFeetInches(p.a.heightIn)}`}</title>
          {(p.a.dunnageIn ?? 0) > 0 &&
            [0.15, 0.85].map((f) => <rect key={f} x={p.x0 + p.a.lengthIn * f - 5} y={y(p.bottom)} width={10} height={p.a.dunnageIn} fill={COLORS.dunnage} />)}
          <rect x={p.x0} y={y(p.top)} width={p.a.lengthIn} height={p.a.heightIn} fill={COLORS.load} fillOpacity={0.85} stroke={COLORS.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={y((p.bottom + p.top) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle" fill={COLORS.ink}>
            {p.a.id}
          </text>
        </g>
      ))}
      {flagsAndLamps}
      {/* overall length and height */}
      <Dim x1={g.xMin} x2={g.xMax} y1={y(0) + fs * 2.2} y2={y(0) + fs * 2.2} label={`overall length ${formatFeetInches(d.lengthIn)}`} fs={fs} side="after" testId="dim-length" />
      <Dim x1={g.xMax + fs * 2.5} x2={g.xMax + fs * 2.5} y1={y(0)} y2={y(d.heightIn)} label={formatFeetInches(d.heightIn)} fs={fs} side="after" testId="dim-height" />
      {d.frontOverhangIn > 0 && (
        <Dim x1={g.xMin} x2={0} y1={-padTop + fs * 2.2} y2={-padTop + fs * 2.2} label={`front overhang ${formatFeetInches(d.frontOverhangIn)}`} fs={fs} testId="dim-front-overhang" />
      )}
      {d.rearOverhangIn > 0 && (
        <Dim
          x1={g.trailerRear}
          x2={g.trailerRear + d.rearOverhangIn}
          y1={-padTop + fs * 2.2}
          y2={-padTop + fs * 2.2}
          label={`rear overhang ${formatFeetInches(d.rearOverhangIn)}`}
          fs={fs}
          testId="dim-rear-overhang"
        />
      )}
      {(d.frontOverhangIn > 0 || d.rearOverhangIn > 0) && (
        <>
          {d.rearOverhangIn > 0 && <line x1={g.trailerRear} x2={g.trailerRear} y1={-padTop + fs * 2.2} y2={y(0)} stroke={COLORS.dim} strokeDasharray={`${fs * 0.3}`} strokeWidth={fs * 0.05} />}
          {d.frontOverhangIn > 0 && <line x1={0} x2={0} y1={-padTop + fs * 2.2} y2={y(0)} stroke={COLORS.dim} strokeDasharray={`${fs * 0.3}`} strokeWidth={fs * 0.05} />}
        </>
      )}
    </ViewFrame>
  );
}

function TopView({ plan, g, markings, px }: { plan: DiagramPlan; g: Geometry; markings: MarkingsResult | null; px: number }) {
  const { tractor, trailer } = plan;
  const span = g.xMax - g.xMin;
  const fs = fontFor(span * 1.15, px);
  const d = g.dims;
  const left = Math.min(-trailer.widthIn / 2, -tractor.widthIn / 2, ...g.articles.map((p) => p.y0));
  const right = Math.max(trailer.widthIn / 2, tractor.widthIn / 2, ...g.articles.map((p) => p.y1));
  // the vehicle faces left: its right (curb) side is up on the page
  const sy = (lateral: number) => -lateral;
  const padL = fs * 2;
  const padR = fs * 7;
  const vbY = -right - fs * 2.5;
  const vbH = right - left + fs * 5;
  const marks: ReactNode[] = [];
  if (markings) {
    markings.flags.forEach((f, i) =>
      markingSpots(f.position, g, i).forEach((s, k) => s.top && marks.push(<Flag key={`f${i}-${k}`} x={s.top.x} y={sy(s.top.y)} fs={fs} title={`Flag: ${f.position} — ${f.reason}`} />)),
    );
    markings.lamps.forEach((l, i) =>
      markingSpots(l.position, g, i).forEach((s, k) => s.top && marks.push(<Lamp key={`l${i}-${k}`} x={s.top.x} y={sy(s.top.y)} fs={fs} color={l.color} title={`Lamp (${l.color}): ${l.position} — ${l.reason}`} />)),
    );
  }
  const driveEnd = Math.max(...g.driveXs) + 36;
  return (
    <ViewFrame title="Top view (front to the left, curb side up)" viewBox={`${g.xMin - padL} ${vbY} ${span + padL + padR} ${vbH}`} testId="diagram-top" maxWidth={SIDE_MAX_PX}>
      <rect x={0} y={sy(tractor.widthIn / 2)} width={driveEnd} height={tractor.widthIn} fill={COLORS.tractor} stroke={COLORS.ink} strokeWidth={fs * 0.08} />
      <rect x={g.trailerFront} y={sy(trailer.widthIn / 2)} width={trailer.lengthIn} height={trailer.widthIn} fill="#e2e8f0" stroke={COLORS.trailer} strokeWidth={fs * 0.1} data-testid="diagram-trailer-top" />
      {trailer.decks.map((s, i) =>
        i > 0 ? <line key={i} x1={g.trailerFront + s.fromFrontIn} x2={g.trailerFront + s.fromFrontIn} y1={sy(trailer.widthIn / 2)} y2={sy(-trailer.widthIn / 2)} stroke={COLORS.trailer} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.4}`} /> : null,
      )}
      {g.articles.map((p) => (
        <g key={p.a.id}>
          <rect x={p.x0} y={sy(p.y1)} width={p.a.lengthIn} height={p.a.widthIn} fill={COLORS.load} fillOpacity={0.75} stroke={COLORS.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={sy((p.y0 + p.y1) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle">
            {p.a.id}
          </text>
        </g>
      ))}
      {marks}
      <text x={g.xMin} y={vbY + fs * 1.2} fontSize={fs * 0.8} fill={COLORS.muted}>
        curb (right) side
      </text>
      <text x={g.xMin} y={vbY + vbH - fs * 0.5} fontSize={fs * 0.8} fill={COLORS.muted}>
        road (left) side
      </text>
      <Dim x1={g.xMax + fs * 2.5} x2={g.xMax + fs * 2.5} y1={sy(right)} y2={sy(left)} label={formatFeetInches(d.widthIn)} fs={fs} side="after" testId="dim-width" />
    </ViewFrame>
  );
}

function RearView({ plan, g, markings, px }: { plan: DiagramPlan; g: Geometry; markings: MarkingsResult | null; px: number }) {
  const { tractor, trailer } = plan;
  const d = g.dims;
  const left = Math.min(-trailer.widthIn / 2, -tractor.widthIn / 2, ...g.articles.map((p) => p.y0));
  const right = Math.max(trailer.widthIn / 2, tractor.widthIn / 2, ...g.articles.map((p) => p.y1));
  const W = right - left;
  const fs = Math.max((W + 200) / 30, (10 * (W + 200) * 1.3) / px);
  const H = g.topMax;
  const y = (h: number) => H - h;
  const rearDeck: DeckSection | undefined = [...trailer.decks].sort((a, b) => b.toFrontIn - a.toFrontIn)[0];
  const deckH = rearDeck?.heightIn ?? 40;
  const padX = fs * 5;
  const padTop = fs * 3;
  const marks: ReactNode[] = [];
  if (markings) {
    markings.flags.forEach((f, i) =>
      markingSpots(f.position, g, i).forEach((s, k) => s.rear && marks.push(<Flag key={`f${i}-${k}`} x={s.rear.y} y={y(s.rear.h)} fs={fs} dir={s.rear.y < 0 ? -1 : 1} title={`Flag: ${f.position} — ${f.reason}`} />)),
    );
    markings.lamps.forEach((l, i) =>
      markingSpots(l.position, g, i).forEach((s, k) => s.rear && marks.push(<Lamp key={`l${i}-${k}`} x={s.rear.y} y={y(s.rear.h) + fs * 0.7} fs={fs} color={l.color} title={`Lamp (${l.color}): ${l.position} — ${l.reason}`} />)),
    );
    markings.signs
      .filter((s) => s.position.toLowerCase().includes('rear'))
      .forEach((s, i) =>
        marks.push(
          <Sign
            key={`s${i}`}
            x={0}
            y={y(deckH) + DECK_T + s.minHeightIn / 2 + 4}
            w={Math.min(s.minWidthIn, trailer.widthIn)}
            h={s.minHeightIn}
            fs={fs}
            text={s.text}
            title={`Sign "${s.text}" ${s.minWidthIn}×${s.minHeightIn} in, ${s.colors}: ${s.position} — ${s.reason}`}
          />,
        ),
      );
  }
  return (
    <ViewFrame title="Rear view (curb side to the right)" viewBox={`${left - padX} ${-padTop} ${W + padX * 2} ${H + padTop + fs * 3}`} testId="diagram-rear" maxWidth={520}>
      <line x1={left - padX} x2={right + padX} y1={y(0)} y2={y(0)} stroke={COLORS.muted} strokeWidth={fs * 0.1} />
      <rect x={-tractor.widthIn / 2} y={y(tractor.heightIn)} width={tractor.widthIn} height={tractor.heightIn * 0.55} fill={COLORS.tractor} opacity={0.6} />
      <rect x={-trailer.widthIn / 2} y={y(deckH)} width={trailer.widthIn} height={DECK_T} fill={COLORS.trailer} />
      {[-1, 1].map((s) => (
        <rect key={s} x={s < 0 ? -trailer.widthIn / 2 + 2 : trailer.widthIn / 2 - 2 - 22} y={y(WHEEL_R * 2)} width={22} height={WHEEL_R * 2} rx={4} fill="#1e293b" />
      ))}
      {g.articles.map((p) => (
        <g key={p.a.id}>
          {(p.a.dunnageIn ?? 0) > 0 && <rect x={p.y0 + 4} y={y(p.bottom)} width={p.a.widthIn - 8} height={p.a.dunnageIn} fill={COLORS.dunnage} />}
          <rect x={p.y0} y={y(p.top)} width={p.a.widthIn} height={p.a.heightIn} fill={COLORS.load} stroke={COLORS.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.y0 + p.y1) / 2} y={y((p.top + p.bottom) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle">
            {p.a.id}
          </text>
        </g>
      ))}
      {marks}
      <Dim x1={left} x2={right} y1={-padTop + fs * 1.8} y2={-padTop + fs * 1.8} label={`width ${formatFeetInches(d.widthIn)}`} fs={fs} />
      <Dim x1={right + fs * 2} x2={right + fs * 2} y1={y(0)} y2={y(d.heightIn)} label={formatFeetInches(d.heightIn)} fs={fs} side="after" />
    </ViewFrame>
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
  if (items.length === 0) return <p style={{ fontSize: 12, color: COLORS.muted }}>No flags, signs or lamps asked for.</p>;
  const swatch = (k: string) =>
    k === 'sign' ? <rect x={1} y={3} width={14} height={8} fill={COLORS.sign} stroke={COLORS.ink} /> : k === 'flag' ? <polygon points="2,2 14,7 2,12" fill={COLORS.flag} stroke={COLORS.ink} /> : <circle cx={7} cy={7} r={5} fill={k === 'lamp-red' ? COLORS.red : COLORS.amber} stroke={COLORS.ink} />;
  return (
    <ul style={{ listStyle: 'none', padding: 0, margin: 0, fontSize: 12 }} data-testid="markings-legend">
      {items.map((i, n) => (
        <li key={n} style={{ display: 'flex', gap: 6, alignItems: 'flex-start', marginBottom: 4 }}>
          <svg width={16} height={14} style={{ flex: 'none', marginTop: 2 }}>
            {swatch(i.kind)}
          </svg>
          <span>
            {i.text}
            {i.reason && <span style={{ color: COLORS.muted }}> ({i.reason})</span>}
            <span style={{ color: COLORS.muted }}> · {i.source}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}
