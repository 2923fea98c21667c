import type { ReactNode } from 'react';
import { Typography } from 'antd';
import type { MarkingsResult, RunSheetDto } from '@amberline/common';
import { ftIn } from '../format';

/*
 * The run sheet's own drawing of the load. The shared load diagram (components/load-diagram.tsx) draws the whole
 * combination from the tractor's and trailer's specifications; the run sheet carries the load's placement, the
 * deck height under each piece, the overall dimensions and the markings, but not the vehicle specifications (and a
 * driver may not read the fleet), so this drawing shows the load on the deck, to scale, with each flag, sign and lamp
 * where the markings put it.
 */

const C = {
  ink: '#0f172a',
  muted: '#64748b',
  road: '#94a3b8',
  deck: '#475569',
  deckTop: '#e2e8f0',
  load: '#fbbf24',
  loadStroke: '#b45309',
  dunnage: '#92400e',
  dim: '#1d4ed8',
  flag: '#ea580c',
  sign: '#facc15',
  red: '#dc2626',
  amber: '#f59e0b',
};

type Piece = { id: string; x0: number; x1: number; y0: number; y1: number; deck: number; bottom: number; top: number };

type Geometry = {
  pieces: Piece[];
  /** Trailer rear behind the trailer front, when the load overhangs it (else unknown from the run sheet). */
  trailerRear: number | null;
  /** Front bumper behind the trailer front, when the load projects ahead of it. */
  bumperX: number | null;
  halfTrailer: number;
  heightIn: number;
  xMin: number;
  xMax: number;
  left: number;
  right: number;
  front: Piece;
  rear: Piece;
  leftmost: Piece;
  rightmost: Piece;
};

function geometry(sheet: RunSheetDto): Geometry | null {
  const d = sheet.dimensions;
  const arts = sheet.move.articles;
  if (arts.length === 0) return null;
  const pieces: Piece[] = arts.map((a, i) => {
    const deck = d.articles[i]?.deckHeightIn ?? 0;
    const bottom = deck + (a.dunnageIn ?? 0);
    const off = a.lateralOffsetIn ?? 0;
    return {
      id: a.id,
      x0: a.positionFromTrailerFrontIn,
      x1: a.positionFromTrailerFrontIn + a.lengthIn,
      y0: off - a.widthIn / 2,
      y1: off + a.widthIn / 2,
      deck,
      bottom,
      top: d.articles[i]?.topIn ?? bottom + a.heightIn,
    };
  });
  const pick = (f: (a: Piece, b: Piece) => boolean) => pieces.reduce((b, a) => (f(a, b) ? a : b));
  const front = pick((a, b) => a.x0 < b.x0);
  const rear = pick((a, b) => a.x1 > b.x1);
  const leftmost = pick((a, b) => a.y0 < b.y0);
  const rightmost = pick((a, b) => a.y1 > b.y1);
  const trailerRear = d.rearOverhangIn > 0 ? rear.x1 - d.rearOverhangIn : null;
  const bumperX = d.frontOverhangIn > 0 ? front.x0 + d.frontOverhangIn : null;
  const halfTrailer = Math.max(12, (d.widthIn - d.sideProjectionLeftIn - d.sideProjectionRightIn) / 2);
  return {
    pieces,
    trailerRear,
    bumperX,
    halfTrailer,
    heightIn: Math.max(d.heightIn, ...pieces.map((p) => p.top)),
    xMin: Math.min(0, front.x0),
    xMax: Math.max(rear.x1, trailerRear ?? 0),
    left: Math.min(-halfTrailer, leftmost.y0),
    right: Math.max(halfTrailer, rightmost.y1),
    front,
    rear,
    leftmost,
    rightmost,
  };
}

/** Where a marking goes, read from its plain-words position. */
export type Spot = { along: 'front' | 'rear' | 'middle' | 'vehicle-front'; side: 'left' | 'right' | 'center'; piece: Piece };

export function spotsFor(position: string, index: number, count: number, g: Geometry, sheet: RunSheetDto): Spot[] {
  const p = position.toLowerCase();
  const left = /\bleft\b/.test(p);
  const right = /\bright\b/.test(p);
  const d = sheet.dimensions;
  const projecting: ('left' | 'right')[] = [
    ...(d.sideProjectionLeftIn > 0 ? (['left'] as const) : []),
    ...(d.sideProjectionRightIn > 0 ? (['right'] as const) : []),
  ];
  const sidesOf = (fallback: ('left' | 'right' | 'center')[]) => (left ? ['left' as const] : right ? ['right' as const] : fallback);
  const pieceFor = (side: 'left' | 'right' | 'center', along: Spot['along']) =>
    side === 'left' && along === 'middle' ? g.leftmost : side === 'right' && along === 'middle' ? g.rightmost : along === 'front' || along === 'vehicle-front' ? g.front : g.rear;
  const make = (along: Spot['along'], sides: ('left' | 'right' | 'center')[]): Spot[] =>
    sides.map((side) => ({ along, side, piece: p.includes('projection') && side !== 'center' ? (side === 'left' ? g.leftmost : g.rightmost) : pieceFor(side, along) }));

  if (p.includes('front of the vehicle')) return make('vehicle-front', ['center']);
  if (p.includes('escort')) return [];
  if (p.includes('corner')) return make(p.includes('front') ? 'front' : 'rear', sidesOf(['left', 'right']));
  if (p.includes('side projection') || p.includes('of the projection') || p.includes('projecting side')) {
    return make(p.includes('front') ? 'front' : 'rear', sidesOf(projecting.length ? projecting : ['left', 'right']));
  }
  if (p.includes('sides of the projecting load')) return make('middle', projecting.length ? projecting : ['left', 'right']);
  if (p.includes('widest')) return make('middle', [index % 2 === 0 ? 'left' : 'right']);
  if (p.includes('overhang')) return make('rear', count > 1 ? [index % 2 === 0 ? 'left' : 'right'] : ['center']);
  if (p.includes('rear')) return make('rear', sidesOf(count > 1 ? ['left', 'right'] : ['center']));
  if (p.includes('front')) return make('front', sidesOf(['center']));
  return [];
}

type Mark = { kind: 'flag' | 'lamp-red' | 'lamp-amber' | 'sign'; title: string; spot: Spot; text?: string; signW?: number; signH?: number };

function marksOf(sheet: RunSheetDto, g: Geometry): Mark[] {
  const m: MarkingsResult = sheet.markings;
  const out: Mark[] = [];
  m.flags.forEach((f, i) =>
    spotsFor(f.position, i, m.flags.filter((x) => x.position.replace(/flag \d+/, '') === f.position.replace(/flag \d+/, '')).length, g, sheet).forEach((spot) =>
      out.push({ kind: 'flag', spot, title: `Flag ${f.minSquareIn}×${f.minSquareIn} in, ${f.colors}: ${f.position} — ${f.reason} (${f.source})` }),
    ),
  );
  m.lamps.forEach((l) =>
    spotsFor(l.position, 0, l.count, g, sheet).forEach((spot) =>
      out.push({ kind: l.color === 'red' ? 'lamp-red' : 'lamp-amber', spot, title: `${l.count} ${l.color} lamp${l.count === 1 ? '' : 's'}: ${l.position} — ${l.reason} (${l.source})` }),
    ),
  );
  m.signs.forEach((s) =>
    spotsFor(s.position, 0, 1, g, sheet).forEach((spot) =>
      out.push({ kind: 'sign', spot, text: s.text, signW: s.minWidthIn, signH: s.minHeightIn, title: `Sign "${s.text}" ${s.minWidthIn}×${s.minHeightIn} in, ${s.colors}: ${s.position} — ${s.reason} (${s.source})` }),
    ),
  );
  return out;
}

function Flag({ x, y, fs, dir, title }: { x: number; y: number; fs: number; dir: 1 | -1; title: string }) {
  const s = fs * 0.9;
  return (
    <g data-testid="run-sheet-flag">
      <title>{title}</title>
      <line x1={x} y1={y} x2={x} y2={y - s * 1.7} stroke={C.ink} strokeWidth={fs * 0.1} />
      <polygon points={`${x},${y - s * 1.7} ${x + dir * s * 1.1},${y - s * 1.3} ${x},${y - s * 0.9}`} fill={C.flag} stroke={C.ink} strokeWidth={fs * 0.05} />
    </g>
  );
}

function Lamp({ x, y, fs, red, title }: { x: number; y: number; fs: number; red: boolean; title: string }) {
  return (
    <g data-testid="run-sheet-lamp">
      <title>{title}</title>
      <circle cx={x} cy={y} r={fs * 0.42} fill={red ? C.red : C.amber} stroke={C.ink} strokeWidth={fs * 0.06} />
    </g>
  );
}

function SignMark({ x, y, w, h, fs, text, title }: { x: number; y: number; w: number; h: number; fs: number; text?: string; title: string }) {
  return (
    <g data-testid="run-sheet-sign">
      <title>{title}</title>
      <rect x={x - w / 2} y={y - h / 2} width={w} height={h} fill={C.sign} stroke={C.ink} strokeWidth={fs * 0.06} />
      {text && (
        <text x={x} y={y} fontSize={Math.min(h * 0.55, fs * 0.75)} textAnchor="middle" dominantBaseline="central" fontWeight={700} fill={C.ink}>
          {text}
        </text>
      )}
    </g>
  );
}

function Dim({ x1, y1, x2, y2, label, fs, anchor = 'middle', dx = 0, dy = 0 }: { x1: number; y1: number; x2: number; y2: number; label: string; fs: number; anchor?: 'start' | 'middle' | 'end'; dx?: number; dy?: number }) {
  const vertical = Math.abs(x2 - x1) < Math.abs(y2 - y1);
  const t = fs * 0.45;
  return (
    <g stroke={C.dim} fill={C.dim}>
      <line x1={x1} y1={y1} x2={x2} y2={y2} strokeWidth={fs * 0.08} />
      {vertical ? (
        <>
          <line x1={x1 - t} x2={x1 + t} y1={y1} y2={y1} strokeWidth={fs * 0.08} />
          <line x1={x2 - t} x2={x2 + t} y1={y2} y2={y2} strokeWidth={fs * 0.08} />
        </>
      ) : (
        <>
          <line x1={x1} x2={x1} y1={y1 - t} y2={y1 + t} strokeWidth={fs * 0.08} />
          <line x1={x2} x2={x2} y1={y2 - t} y2={y2 + t} strokeWidth={fs * 0.08} />
        </>
      )}
      <text x={(x1 + x2) / 2 + dx} y={(y1 + y2) / 2 + dy} fontSize={fs} stroke="none" textAnchor={anchor} dominantBaseline="central">
        {label}
      </text>
    </g>
  );
}

function Frame({ title, viewBox, testId, children, maxWidth }: { title: string; viewBox: [number, number, number, number]; testId: string; children: ReactNode; maxWidth?: number }) {
  return (
    <figure style={{ margin: '0 0 12px' }}>
      <figcaption style={{ fontSize: 12, color: C.muted, marginBottom: 2 }}>{title}</figcaption>
      <svg
        viewBox={viewBox.join(' ')}
        width="100%"
        role="img"
        aria-label={title}
        data-testid={testId}
        style={{ display: 'block', maxWidth, background: '#fff', border: '1px solid #e2e8f0', borderRadius: 4 }}
      >
        {children}
      </svg>
    </figure>
  );
}

function SideView({ sheet, g, marks }: { sheet: RunSheetDto; g: Geometry; marks: Mark[] }) {
  const d = sheet.dimensions;
  const span = g.xMax - g.xMin;
  const fs = Math.max(12, span / 22);
  const H = g.heightIn;
  const y = (h: number) => H - h;
  const padL = fs * 2.5;
  const padR = fs * 6;
  const padTop = fs * 4.2;
  const padBottom = fs * 1.5;
  const xOf = (s: Spot) => (s.along === 'front' || s.along === 'vehicle-front' ? s.piece.x0 : s.along === 'rear' ? s.piece.x1 : (s.piece.x0 + s.piece.x1) / 2);
  const drawn: ReactNode[] = [];
  const seen = new Set<string>();
  marks.forEach((m, i) => {
    // the side view shows the driver's (left) side; a center or right-side mark at the same place is drawn once
    const key = `${m.kind}:${m.spot.along}:${m.spot.piece.id}`;
    if (m.spot.side === 'right' && marks.some((o) => o !== m && o.kind === m.kind && o.spot.along === m.spot.along && o.spot.side === 'left')) return;
    if (seen.has(key)) return;
    seen.add(key);
    const x = xOf(m.spot);
    const top = m.spot.piece.top;
    if (m.kind === 'flag') drawn.push(<Flag key={i} x={x} y={y(top)} fs={fs} dir={m.spot.along === 'front' ? -1 : 1} title={m.title} />);
    else if (m.kind === 'sign') {
      const sx = m.spot.along === 'vehicle-front' ? g.xMin - fs * 1.2 : g.xMax + fs * 1.2;
      drawn.push(<SignMark key={i} x={sx} y={y(Math.min(H * 0.55, (m.signH ?? 18) + 36))} w={fs * 0.6} h={Math.min(m.signH ?? 18, H * 0.4)} fs={fs} title={m.title} />);
    } else drawn.push(<Lamp key={i} x={x} y={y(top) + fs * 0.9} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />);
  });
  const vb: [number, number, number, number] = [g.xMin - padL, -padTop, span + padL + padR, H + padTop + padBottom];
  return (
    <Frame title="Side view, driver's side (front to the left)" viewBox={vb} testId="run-sheet-diagram-side">
      <line x1={vb[0]} x2={vb[0] + vb[2]} y1={y(0)} y2={y(0)} stroke={C.road} strokeWidth={fs * 0.12} />
      {/* trailer front (and rear, when the load overhangs it) */}
      <line x1={0} x2={0} y1={y(0)} y2={y(Math.min(H, 60))} stroke={C.deck} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.3}`} />
      <text x={0} y={y(0) + fs * 0.9} fontSize={fs * 0.75} fill={C.muted} textAnchor="start">
        trailer front
      </text>
      {g.trailerRear !== null && (
        <>
          <line x1={g.trailerRear} x2={g.trailerRear} y1={y(0)} y2={y(g.rear.deck)} stroke={C.deck} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.3}`} />
          <text x={g.trailerRear} y={y(0) + fs * 0.9} fontSize={fs * 0.75} fill={C.muted} textAnchor="end">
            trailer rear
          </text>
        </>
      )}
      {g.pieces.map((p) => {
        const x0 = Math.max(0, p.x0 - 12);
        const x1 = g.trailerRear !== null ? Math.min(g.trailerRear, p.x1 + 12) : p.x1 + 12;
        const art = sheet.move.articles.find((a) => a.id === p.id);
        const dunnage = art?.dunnageIn ?? 0;
        return (
          <g key={p.id} data-testid="run-sheet-piece">
            <title>{`${p.id}${art?.description ? ` (${art.description})` : ''}: on a deck ${ftIn(p.deck)} above the road, top ${ftIn(p.top)}`}</title>
            <rect x={x0} y={y(p.deck)} width={Math.max(0, x1 - x0)} height={8} fill={C.deck} />
            {dunnage > 0 && [0.15, 0.85].map((f) => <rect key={f} x={p.x0 + (p.x1 - p.x0) * f - 5} y={y(p.bottom)} width={10} height={dunnage} fill={C.dunnage} />)}
            <rect x={p.x0} y={y(p.top)} width={p.x1 - p.x0} height={p.top - p.bottom} fill={C.load} fillOpacity={0.85} stroke={C.loadStroke} strokeWidth={fs * 0.1} />
            <text x={(p.x0 + p.x1) / 2} y={y((p.bottom + p.top) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="central" fill={C.ink}>
              {p.id}
            </text>
          </g>
        );
      })}
      {drawn}
      <Dim x1={g.xMax + fs * 2.2} x2={g.xMax + fs * 2.2} y1={y(0)} y2={y(d.heightIn)} label={ftIn(d.heightIn)} fs={fs} anchor="start" dx={fs * 0.6} />
      {g.trailerRear !== null && (
        <Dim x1={g.trailerRear} x2={g.rear.x1} y1={-padTop + fs * 1.4} y2={-padTop + fs * 1.4} label={`rear overhang ${ftIn(d.rearOverhangIn)}`} fs={fs * 0.85} anchor="end" dy={-fs * 0.05} dx={-(g.rear.x1 - g.trailerRear) / 2 - fs * 0.5} />
      )}
      <Dim x1={g.front.x0} x2={g.rear.x1} y1={-padTop + fs * 3} y2={-padTop + fs * 3} label="" fs={fs * 0.85} />
      <text x={(g.front.x0 + g.rear.x1) / 2} y={-padTop + fs * 2.4} fontSize={fs * 0.85} textAnchor="middle" fill={C.dim}>
        {`load ${ftIn(g.rear.x1 - g.front.x0)}`}
      </text>
    </Frame>
  );
}

function TopView({ sheet, g, marks }: { sheet: RunSheetDto; g: Geometry; marks: Mark[] }) {
  const d = sheet.dimensions;
  const span = g.xMax - g.xMin;
  const fs = Math.max(12, span / 22);
  const sy = (lateral: number) => -lateral; // facing left, the curb (right) side is up
  const padL = fs * 2.5;
  const padR = fs * 6;
  const vb: [number, number, number, number] = [g.xMin - padL, -g.right - fs * 3, span + padL + padR, g.right - g.left + fs * 5];
  const deckEnd = g.trailerRear ?? g.rear.x1;
  const yOf = (s: Spot) => (s.side === 'left' ? s.piece.y0 : s.side === 'right' ? s.piece.y1 : (s.piece.y0 + s.piece.y1) / 2);
  const xOf = (s: Spot) => (s.along === 'front' ? s.piece.x0 : s.along === 'rear' ? s.piece.x1 : (s.piece.x0 + s.piece.x1) / 2);
  return (
    <Frame title="Top view (front to the left, curb side up)" viewBox={vb} testId="run-sheet-diagram-top">
      <rect x={0} y={sy(g.halfTrailer)} width={deckEnd} height={g.halfTrailer * 2} fill={C.deckTop} stroke={C.deck} strokeWidth={fs * 0.08} strokeDasharray={g.trailerRear === null ? `${fs * 0.4}` : undefined} />
      {g.pieces.map((p) => (
        <g key={p.id}>
          <rect x={p.x0} y={sy(p.y1)} width={p.x1 - p.x0} height={p.y1 - p.y0} fill={C.load} fillOpacity={0.8} stroke={C.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={sy((p.y0 + p.y1) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="central">
            {p.id}
          </text>
        </g>
      ))}
      {marks
        .filter((m) => m.kind !== 'sign' && m.spot.along !== 'vehicle-front')
        .map((m, i) =>
          m.kind === 'flag' ? (
            <Flag key={i} x={xOf(m.spot)} y={sy(yOf(m.spot))} fs={fs} dir={m.spot.along === 'front' ? -1 : 1} title={m.title} />
          ) : (
            <Lamp key={i} x={xOf(m.spot) + (m.spot.along === 'front' ? fs * 0.6 : -fs * 0.6)} y={sy(yOf(m.spot))} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />
          ),
        )}
      <text x={g.xMin} y={vb[1] + fs * 1.1} fontSize={fs * 0.75} fill={C.muted}>
        curb (right) side
      </text>
      <text x={g.xMin} y={vb[1] + vb[3] - fs * 0.4} fontSize={fs * 0.75} fill={C.muted}>
        road (left) side
      </text>
      <Dim x1={g.xMax + fs * 2.2} x2={g.xMax + fs * 2.2} y1={sy(g.right)} y2={sy(g.left)} label={ftIn(d.widthIn)} fs={fs} anchor="start" dx={fs * 0.6} />
    </Frame>
  );
}

function RearView({ sheet, g, marks }: { sheet: RunSheetDto; g: Geometry; marks: Mark[] }) {
  const d = sheet.dimensions;
  const W = g.right - g.left;
  const fs = Math.max(9, (W + 160) / 24);
  const H = g.heightIn;
  const y = (h: number) => H - h;
  const padX = fs * 4.5;
  const padTop = fs * 3.6;
  const deck = g.rear.deck;
  const vb: [number, number, number, number] = [g.left - padX, -padTop, W + padX * 2, H + padTop + fs * 1.5];
  const latOf = (s: Spot) => (s.side === 'left' ? s.piece.y0 : s.side === 'right' ? s.piece.y1 : (s.piece.y0 + s.piece.y1) / 2);
  return (
    <Frame title="Rear view (curb side to the right)" viewBox={vb} testId="run-sheet-diagram-rear" maxWidth={420}>
      <line x1={vb[0]} x2={vb[0] + vb[2]} y1={y(0)} y2={y(0)} stroke={C.road} strokeWidth={fs * 0.12} />
      <rect x={-g.halfTrailer} y={y(deck)} width={g.halfTrailer * 2} height={8} fill={C.deck} />
      {[-1, 1].map((s) => (
        <rect key={s} x={s < 0 ? -g.halfTrailer + 2 : g.halfTrailer - 24} y={y(40)} width={22} height={40} rx={4} fill="#1e293b" />
      ))}
      {g.pieces.map((p) => (
        <g key={p.id}>
          <rect x={p.y0} y={y(p.top)} width={p.y1 - p.y0} height={p.top - p.bottom} fill={C.load} fillOpacity={0.75} stroke={C.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.y0 + p.y1) / 2} y={y((p.top + p.bottom) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="central">
            {p.id}
          </text>
        </g>
      ))}
      {marks
        .filter((m) => m.spot.along !== 'vehicle-front' && m.spot.along !== 'front')
        .map((m, i) => {
          const lat = latOf(m.spot);
          if (m.kind === 'flag') return <Flag key={i} x={lat} y={y(m.spot.piece.top)} fs={fs} dir={lat < 0 ? -1 : 1} title={m.title} />;
          if (m.kind === 'sign') {
            const w = Math.min(m.signW ?? 84, g.halfTrailer * 2);
            const h = m.signH ?? 18;
            return <SignMark key={i} x={0} y={y(deck) + 8 + h / 2 + 4} w={w} h={h} fs={fs} text={m.text} title={m.title} />;
          }
          const lampLat = m.spot.side === 'center' ? lat : lat + (lat < 0 ? fs * 0.6 : -fs * 0.6);
          return <Lamp key={i} x={lampLat} y={y(m.spot.piece.top) + fs * 0.9} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />;
        })}
      <Dim x1={g.left} x2={g.right} y1={-padTop + fs * 1.7} y2={-padTop + fs * 1.7} label="" fs={fs} />
      <text x={(g.left + g.right) / 2} y={-padTop + fs * 0.1} fontSize={fs} dominantBaseline="hanging" textAnchor="middle" fill={C.dim}>
        {`width ${ftIn(d.widthIn)}`}
      </text>
      <Dim x1={g.right + fs * 1.6} x2={g.right + fs * 1.6} y1={y(0)} y2={y(d.heightIn)} label={ftIn(d.heightIn)} fs={fs} anchor="start" dx={fs * 0.5} />
    </Frame>
  );
}

/** Side, top and rear views of this load on the deck with its flags, signs and lamps, and the overall dimensions. */
export function RunSheetDiagram({ sheet }: { sheet: RunSheetDto }) {
  const g = geometry(sheet);
  if (!g) return <Typography.Text type="secondary">No load pieces on this move.</Typography.Text>;
  const marks = marksOf(sheet, g);
  return (
    <div data-testid="run-sheet-diagram">
      <SideView sheet={sheet} g={g} marks={marks} />
      <TopView sheet={sheet} g={g} marks={marks} />
      <RearView sheet={sheet} g={g} marks={marks} />
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, marginBottom: 0 }}>
        Drawn to scale from the planned placement; the tractor is not drawn. Orange flags, red and amber dots for lamps, yellow
        boards for signs; each is listed below with its rule and source.
      </Typography.Paragraph>
    </div>
  );
}
