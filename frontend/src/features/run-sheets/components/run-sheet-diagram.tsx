import type { ReactNode } from 'react';
import { Typography } from 'antd';
import type { RunSheetDto } from '@amberline/common';
import { Dim, Flag, Frame, Lamp, Sign } from '../../../components/diagram/marks';
import { PALETTE as C } from '../../../components/diagram/palette';
import { extremesOf, placeMarkings, spotLateral, spotX, type DrawnPiece, type PlacedMark } from '../../../components/diagram/placement';
import { ftIn } from '../format';

/*
 * The run sheet's own drawing of the load. The shared load diagram (components/diagram/load-diagram.tsx; both use the kit in components/diagram) draws the whole
 * combination from the tractor's and trailer's specifications; the run sheet carries the load's placement, the
 * deck height under each piece, the overall dimensions and the markings, but not the vehicle specifications (and a
 * driver may not read the fleet), so this drawing shows the load on the deck, to scale, with each flag, sign and lamp
 * where the markings put it.
 */

type Piece = DrawnPiece;

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
  const { front, rear, leftmost, rightmost } = extremesOf(pieces)!;
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

type Mark = PlacedMark & { title: string };

/** The markings at their places on the pieces, each with its hover text (what, where, why and the source). */
function marksOf(sheet: RunSheetDto, g: Geometry): Mark[] {
  const d = sheet.dimensions;
  const projecting = [...(d.sideProjectionLeftIn > 0 ? (['left'] as const) : []), ...(d.sideProjectionRightIn > 0 ? (['right'] as const) : [])];
  return placeMarkings(sheet.markings, g.pieces, projecting).map((m) => {
    if (m.kind === 'flag') {
      const f = m.marking;
      return { ...m, title: `Flag ${f.minSquareIn}×${f.minSquareIn} in, ${f.colors}: ${f.position} — ${f.reason} (${f.source})` };
    }
    if (m.kind === 'sign') {
      const x = m.marking;
      return { ...m, title: `Sign "${x.text}" ${x.minWidthIn}×${x.minHeightIn} in, ${x.colors}: ${x.position} — ${x.reason} (${x.source})` };
    }
    const l = m.marking;
    return { ...m, title: `${l.count} ${l.color} lamp${l.count === 1 ? '' : 's'}: ${l.position} — ${l.reason} (${l.source})` };
  });
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
  const drawn: ReactNode[] = [];
  const seen = new Set<string>();
  marks.forEach((m, i) => {
    // the side view shows the driver's (left) side; a center or right-side mark at the same place is drawn once
    const key = `${m.kind}:${m.spot.along}:${m.piece.id}`;
    if (m.spot.side === 'right' && marks.some((o) => o !== m && o.kind === m.kind && o.spot.along === m.spot.along && o.spot.side === 'left')) return;
    if (seen.has(key)) return;
    seen.add(key);
    const x = spotX(m.spot, m.piece);
    const top = m.piece.top;
    if (m.kind === 'flag') drawn.push(<Flag key={i} variant="sheet" x={x} y={y(top)} fs={fs} dir={m.spot.along === 'front' ? -1 : 1} title={m.title} />);
    else if (m.kind === 'sign') {
      const sx = m.spot.along === 'front' ? g.xMin - fs * 1.2 : g.xMax + fs * 1.2;
      drawn.push(<Sign key={i} variant="sheet" x={sx} y={y(Math.min(H * 0.55, m.marking.minHeightIn + 36))} w={fs * 0.6} h={Math.min(m.marking.minHeightIn, H * 0.4)} fs={fs} title={m.title} />);
    } else drawn.push(<Lamp key={i} variant="sheet" x={x} y={y(top) + fs * 0.9} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />);
  });
  const vb: [number, number, number, number] = [g.xMin - padL, -padTop, span + padL + padR, H + padTop + padBottom];
  return (
    <Frame title="Side view, driver's side (front to the left)" viewBox={vb} testId="run-sheet-diagram-side">
      <line x1={vb[0]} x2={vb[0] + vb[2]} y1={y(0)} y2={y(0)} stroke={C.road} strokeWidth={fs * 0.12} />
      {/* trailer front (and rear, when the load overhangs it) */}
      <line x1={0} x2={0} y1={y(0)} y2={y(Math.min(H, 60))} stroke={C.trailer} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.3}`} />
      <text x={0} y={y(0) + fs * 0.9} fontSize={fs * 0.75} fill={C.muted} textAnchor="start">
        trailer front
      </text>
      {g.trailerRear !== null && (
        <>
          <line x1={g.trailerRear} x2={g.trailerRear} y1={y(0)} y2={y(g.rear.deck)} stroke={C.trailer} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.3}`} />
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
            <rect x={x0} y={y(p.deck)} width={Math.max(0, x1 - x0)} height={8} fill={C.trailer} />
            {dunnage > 0 && [0.15, 0.85].map((f) => <rect key={f} x={p.x0 + (p.x1 - p.x0) * f - 5} y={y(p.bottom)} width={10} height={dunnage} fill={C.dunnage} />)}
            <rect x={p.x0} y={y(p.top)} width={p.x1 - p.x0} height={p.top - p.bottom} fill={C.load} fillOpacity={0.85} stroke={C.loadStroke} strokeWidth={fs * 0.1} />
            <text x={(p.x0 + p.x1) / 2} y={y((p.bottom + p.top) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="central" fill={C.ink}>
              {p.id}
            </text>
          </g>
        );
      })}
      {drawn}
      <Dim variant="sheet" x1={g.xMax + fs * 2.2} x2={g.xMax + fs * 2.2} y1={y(0)} y2={y(d.heightIn)} label={ftIn(d.heightIn)} fs={fs} anchor="start" dx={fs * 0.6} />
      {g.trailerRear !== null && (
        <Dim variant="sheet" x1={g.trailerRear} x2={g.rear.x1} y1={-padTop + fs * 1.4} y2={-padTop + fs * 1.4} label={`rear overhang ${ftIn(d.rearOverhangIn)}`} fs={fs * 0.85} anchor="end" dy={-fs * 0.05} dx={-(g.rear.x1 - g.trailerRear) / 2 - fs * 0.5} />
      )}
      <Dim variant="sheet" x1={g.front.x0} x2={g.rear.x1} y1={-padTop + fs * 3} y2={-padTop + fs * 3} label="" fs={fs * 0.85} />
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
  return (
    <Frame title="Top view (front to the left, curb side up)" viewBox={vb} testId="run-sheet-diagram-top">
      <rect x={0} y={sy(g.halfTrailer)} width={deckEnd} height={g.halfTrailer * 2} fill={C.deckTop} stroke={C.trailer} strokeWidth={fs * 0.08} strokeDasharray={g.trailerRear === null ? `${fs * 0.4}` : undefined} />
      {g.pieces.map((p) => (
        <g key={p.id}>
          <rect x={p.x0} y={sy(p.y1)} width={p.x1 - p.x0} height={p.y1 - p.y0} fill={C.load} fillOpacity={0.8} stroke={C.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={sy((p.y0 + p.y1) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="central">
            {p.id}
          </text>
        </g>
      ))}
      {marks
        .filter((m) => m.kind !== 'sign' && m.spot.on !== 'vehicle')
        .map((m, i) =>
          m.kind === 'flag' ? (
            <Flag key={i} variant="sheet" x={spotX(m.spot, m.piece)} y={sy(spotLateral(m.spot, m.piece))} fs={fs} dir={m.spot.along === 'front' ? -1 : 1} title={m.title} />
          ) : (
            <Lamp key={i} variant="sheet" x={spotX(m.spot, m.piece) + (m.spot.along === 'front' ? fs * 0.6 : -fs * 0.6)} y={sy(spotLateral(m.spot, m.piece))} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />
          ),
        )}
      <text x={g.xMin} y={vb[1] + fs * 1.1} fontSize={fs * 0.75} fill={C.muted}>
        curb (right) side
      </text>
      <text x={g.xMin} y={vb[1] + vb[3] - fs * 0.4} fontSize={fs * 0.75} fill={C.muted}>
        road (left) side
      </text>
      <Dim variant="sheet" x1={g.xMax + fs * 2.2} x2={g.xMax + fs * 2.2} y1={sy(g.right)} y2={sy(g.left)} label={ftIn(d.widthIn)} fs={fs} anchor="start" dx={fs * 0.6} />
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
  return (
    <Frame title="Rear view (curb side to the right)" viewBox={vb} testId="run-sheet-diagram-rear" maxWidth={420}>
      <line x1={vb[0]} x2={vb[0] + vb[2]} y1={y(0)} y2={y(0)} stroke={C.road} strokeWidth={fs * 0.12} />
      <rect x={-g.halfTrailer} y={y(deck)} width={g.halfTrailer * 2} height={8} fill={C.trailer} />
      {[-1, 1].map((s) => (
        <rect key={s} x={s < 0 ? -g.halfTrailer + 2 : g.halfTrailer - 24} y={y(40)} width={22} height={40} rx={4} fill={C.wheel} />
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
        .filter((m) => m.spot.along !== 'front')
        .map((m, i) => {
          const lat = spotLateral(m.spot, m.piece);
          if (m.kind === 'flag') return <Flag key={i} variant="sheet" x={lat} y={y(m.piece.top)} fs={fs} dir={lat < 0 ? -1 : 1} title={m.title} />;
          if (m.kind === 'sign') {
            const w = Math.min(m.marking.minWidthIn, g.halfTrailer * 2);
            const h = m.marking.minHeightIn;
            return <Sign key={i} variant="sheet" x={0} y={y(deck) + 8 + h / 2 + 4} w={w} h={h} fs={fs} text={m.marking.text} title={m.title} />;
          }
          const lampLat = m.spot.side === 'center' ? lat : lat + (lat < 0 ? fs * 0.6 : -fs * 0.6);
          return <Lamp key={i} variant="sheet" x={lampLat} y={y(m.piece.top) + fs * 0.9} fs={fs} red={m.kind === 'lamp-red'} title={m.title} />;
        })}
      <Dim variant="sheet" x1={g.left} x2={g.right} y1={-padTop + fs * 1.7} y2={-padTop + fs * 1.7} label="" fs={fs} />
      <text x={(g.left + g.right) / 2} y={-padTop + fs * 0.1} fontSize={fs} dominantBaseline="hanging" textAnchor="middle" fill={C.dim}>
        {`width ${ftIn(d.widthIn)}`}
      </text>
      <Dim variant="sheet" x1={g.right + fs * 1.6} x2={g.right + fs * 1.6} y1={y(0)} y2={y(d.heightIn)} label={ftIn(d.heightIn)} fs={fs} anchor="start" dx={fs * 0.5} />
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
