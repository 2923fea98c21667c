/** The plan drawing's three views: side, top and rear, to scale, with the markings' flags, lamps and signs in place. */
import type { ReactNode } from 'react';
import { formatFeetInches, type DeckSection } from '@amberline/common';
import type { DiagramPlan, Geometry } from './load-geometry';
import { Dim, Flag, Frame, Lamp, Sign } from './marks';
import { PALETTE, SIDE_MAX_PX, fontFor } from './palette';
import { spotLateral, spotX, type PlacedMark } from './placement';

const WHEEL_R = 20;
const DECK_T = 10;

/** A mark's hover text: what it is, where and why. */
export function markTitle(m: PlacedMark): string {
  if (m.kind === 'flag') return `Flag: ${m.marking.position} — ${m.marking.reason}`;
  if (m.kind === 'sign') {
    const s = m.marking;
    return `Sign "${s.text}" ${s.minWidthIn}×${s.minHeightIn} in, ${s.colors}: ${s.position} — ${s.reason}`;
  }
  return `Lamp (${m.marking.color}): ${m.marking.position} — ${m.marking.reason}`;
}

export function SideView({ plan, g, marks, px }: { plan: DiagramPlan; g: Geometry; marks: PlacedMark[]; px: number }) {
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
  const drawn: ReactNode[] = [];
  const seen = new Set<string>();
  marks.forEach((m, i) => {
    // the side view shows the driver's (left) side; a center or right-side mark at the same place is drawn once
    if (m.spot.side === 'right' && marks.some((o) => o !== m && o.kind === m.kind && o.spot.along === m.spot.along && o.spot.side === 'left')) return;
    const key = `${m.kind}:${m.spot.along}:${m.spot.on}:${m.piece.id}`;
    if (seen.has(key)) return;
    seen.add(key);
    const front = m.spot.along === 'front';
    if (m.kind === 'sign') {
      const s = m.marking;
      const x = front ? Math.min(0, g.xMin) - fs * 0.45 : g.xMax + fs * 0.45;
      drawn.push(<Sign key={i} x={x} y={y(s.minHeightIn + 40) + s.minHeightIn / 2} w={fs * 0.5} h={s.minHeightIn} fs={fs} edge={0.05} title={markTitle(m)} />);
      return;
    }
    const onVehicle = m.spot.on === 'vehicle';
    const x = onVehicle ? (front ? Math.min(0, g.xMin) : Math.max(m.piece.x1, g.trailerRear)) : spotX(m.spot, m.piece);
    const h = onVehicle ? (front ? 60 : m.piece.deck) : m.piece.top;
    if (m.kind === 'flag') drawn.push(<Flag key={i} x={x} y={y(h)} fs={fs} dir={x < g.kingpinX ? -1 : 1} title={markTitle(m)} />);
    else drawn.push(<Lamp key={i} x={x} y={y(h) + fs * 0.6} fs={fs} red={m.kind === 'lamp-red'} title={markTitle(m)} />);
  });
  return (
    <Frame title="Side view (driver's side, front to the left)" viewBox={`${vbX} ${-padTop} ${vbW} ${H + padTop + padBottom}`} testId="diagram-side" maxWidth={SIDE_MAX_PX}>
      {/* road */}
      <line x1={vbX} x2={vbX + vbW} y1={y(0)} y2={y(0)} stroke={PALETTE.muted} strokeWidth={fs * 0.1} />
      {/* tractor: frame, cab, stack, fifth wheel */}
      <rect x={0} y={y(44)} width={Math.max(...g.driveXs) + 36} height={12} fill={PALETTE.tractor} stroke={PALETTE.ink} strokeWidth={fs * 0.06} />
      <polygon points={cab} fill={PALETTE.tractor} stroke={PALETTE.ink} strokeWidth={fs * 0.08} data-testid="diagram-tractor" />
      <rect x={cabEnd - 2} y={y(th)} width={6} height={th - th * 0.8} fill={PALETTE.muted} />
      <rect x={g.kingpinX - 18} y={y(52)} width={36} height={8} fill={PALETTE.ink} />
      {[g.steerX, ...g.driveXs].map((x, i) => (
        <circle key={`tw${i}`} cx={x} cy={y(WHEEL_R)} r={WHEEL_R} fill={PALETTE.wheel} />
      ))}
      {/* trailer decks at their heights, with the steps between them */}
      {decks.map((s, i) => {
        const x0 = g.trailerFront + s.fromFrontIn;
        const x1 = g.trailerFront + s.toFrontIn;
        const next = decks[i + 1];
        return (
          <g key={s.name + i} data-testid="diagram-deck">
            <title>{`${s.name}: ${formatFeetInches(s.heightIn)} above the road`}</title>
            <rect x={x0} y={y(s.heightIn)} width={x1 - x0} height={DECK_T} fill={PALETTE.trailer} />
            {next && next.heightIn !== s.heightIn && (
              <line x1={x1} x2={x1} y1={y(s.heightIn)} y2={y(next.heightIn) + DECK_T} stroke={PALETTE.trailer} strokeWidth={DECK_T * 0.8} />
            )}
          </g>
        );
      })}
      {trailer.heightIn ? <rect x={g.trailerFront} y={y(trailer.heightIn)} width={8} height={trailer.heightIn - (decks[0]?.heightIn ?? 0)} fill={PALETTE.trailer} /> : null}
      {g.trailerAxleXs.map((x, i) => {
        const deckH = deckLevel(x) ?? decks[decks.length - 1]?.heightIn ?? 40;
        return (
          <g key={`rw${i}`}>
            <line x1={x} x2={x} y1={y(deckH)} y2={y(WHEEL_R)} stroke={PALETTE.trailer} strokeWidth={6} />
            <circle cx={x} cy={y(WHEEL_R)} r={WHEEL_R} fill={PALETTE.wheel} data-testid="diagram-trailer-axle" />
          </g>
        );
      })}
      {/* load pieces with dunnage */}
      {g.articles.map((p) => (
        <g key={p.a.id} data-testid="diagram-piece">
          <title>{`${p.a.id}${p.a.description ? ` (${p.a.description})` : ''}: ${formatFeetInches(p.a.lengthIn)} × ${formatFeetInches(p.a.widthIn)} × ${formatFeetInches(p.a.heightIn)}`}</title>
          {(p.a.dunnageIn ?? 0) > 0 &&
            [0.15, 0.85].map((f) => <rect key={f} x={p.x0 + p.a.lengthIn * f - 5} y={y(p.bottom)} width={10} height={p.a.dunnageIn} fill={PALETTE.dunnage} />)}
          <rect x={p.x0} y={y(p.top)} width={p.a.lengthIn} height={p.a.heightIn} fill={PALETTE.load} fillOpacity={0.85} stroke={PALETTE.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={y((p.bottom + p.top) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle" fill={PALETTE.ink}>
            {p.a.id}
          </text>
        </g>
      ))}
      {drawn}
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
          {d.rearOverhangIn > 0 && <line x1={g.trailerRear} x2={g.trailerRear} y1={-padTop + fs * 2.2} y2={y(0)} stroke={PALETTE.dim} strokeDasharray={`${fs * 0.3}`} strokeWidth={fs * 0.05} />}
          {d.frontOverhangIn > 0 && <line x1={0} x2={0} y1={-padTop + fs * 2.2} y2={y(0)} stroke={PALETTE.dim} strokeDasharray={`${fs * 0.3}`} strokeWidth={fs * 0.05} />}
        </>
      )}
    </Frame>
  );
}

export function TopView({ plan, g, marks, px }: { plan: DiagramPlan; g: Geometry; marks: PlacedMark[]; px: number }) {
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
  const drawn = marks
    .filter((m) => m.kind !== 'sign' && m.spot.on !== 'vehicle')
    .map((m, i) =>
      m.kind === 'flag' ? (
        <Flag key={i} x={spotX(m.spot, m.piece)} y={sy(spotLateral(m.spot, m.piece))} fs={fs} title={markTitle(m)} />
      ) : (
        <Lamp key={i} x={spotX(m.spot, m.piece)} y={sy(spotLateral(m.spot, m.piece))} fs={fs} red={m.kind === 'lamp-red'} title={markTitle(m)} />
      ),
    );
  const driveEnd = Math.max(...g.driveXs) + 36;
  return (
    <Frame title="Top view (front to the left, curb side up)" viewBox={`${g.xMin - padL} ${vbY} ${span + padL + padR} ${vbH}`} testId="diagram-top" maxWidth={SIDE_MAX_PX}>
      <rect x={0} y={sy(tractor.widthIn / 2)} width={driveEnd} height={tractor.widthIn} fill={PALETTE.tractor} stroke={PALETTE.ink} strokeWidth={fs * 0.08} />
      <rect x={g.trailerFront} y={sy(trailer.widthIn / 2)} width={trailer.lengthIn} height={trailer.widthIn} fill={PALETTE.deckTop} stroke={PALETTE.trailer} strokeWidth={fs * 0.1} data-testid="diagram-trailer-top" />
      {trailer.decks.map((s, i) =>
        i > 0 ? <line key={i} x1={g.trailerFront + s.fromFrontIn} x2={g.trailerFront + s.fromFrontIn} y1={sy(trailer.widthIn / 2)} y2={sy(-trailer.widthIn / 2)} stroke={PALETTE.trailer} strokeWidth={fs * 0.08} strokeDasharray={`${fs * 0.4}`} /> : null,
      )}
      {g.articles.map((p) => (
        <g key={p.a.id}>
          <rect x={p.x0} y={sy(p.y1)} width={p.a.lengthIn} height={p.a.widthIn} fill={PALETTE.load} fillOpacity={0.75} stroke={PALETTE.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.x0 + p.x1) / 2} y={sy((p.y0 + p.y1) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle">
            {p.a.id}
          </text>
        </g>
      ))}
      {drawn}
      <text x={g.xMin} y={vbY + fs * 1.2} fontSize={fs * 0.8} fill={PALETTE.muted}>
        curb (right) side
      </text>
      <text x={g.xMin} y={vbY + vbH - fs * 0.5} fontSize={fs * 0.8} fill={PALETTE.muted}>
        road (left) side
      </text>
      <Dim x1={g.xMax + fs * 2.5} x2={g.xMax + fs * 2.5} y1={sy(right)} y2={sy(left)} label={formatFeetInches(d.widthIn)} fs={fs} side="after" testId="dim-width" />
    </Frame>
  );
}

export function RearView({ plan, g, marks, px }: { plan: DiagramPlan; g: Geometry; marks: PlacedMark[]; px: number }) {
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
  const drawn = marks
    .filter((m) => m.spot.along !== 'front')
    .map((m, i) => {
      if (m.kind === 'sign') {
        const s = m.marking;
        return <Sign key={i} x={0} y={y(deckH) + DECK_T + s.minHeightIn / 2 + 4} w={Math.min(s.minWidthIn, trailer.widthIn)} h={s.minHeightIn} fs={fs} text={s.text} title={markTitle(m)} />;
      }
      const lat = spotLateral(m.spot, m.piece);
      if (m.kind === 'flag') return <Flag key={i} x={lat} y={y(m.piece.top)} fs={fs} dir={lat < 0 ? -1 : 1} title={markTitle(m)} />;
      return <Lamp key={i} x={lat} y={y(m.piece.top) + fs * 0.7} fs={fs} red={m.kind === 'lamp-red'} title={markTitle(m)} />;
    });
  return (
    <Frame title="Rear view (curb side to the right)" viewBox={`${left - padX} ${-padTop} ${W + padX * 2} ${H + padTop + fs * 3}`} testId="diagram-rear" maxWidth={520}>
      <line x1={left - padX} x2={right + padX} y1={y(0)} y2={y(0)} stroke={PALETTE.muted} strokeWidth={fs * 0.1} />
      <rect x={-tractor.widthIn / 2} y={y(tractor.heightIn)} width={tractor.widthIn} height={tractor.heightIn * 0.55} fill={PALETTE.tractor} opacity={0.6} />
      <rect x={-trailer.widthIn / 2} y={y(deckH)} width={trailer.widthIn} height={DECK_T} fill={PALETTE.trailer} />
      {[-1, 1].map((s) => (
        <rect key={s} x={s < 0 ? -trailer.widthIn / 2 + 2 : trailer.widthIn / 2 - 2 - 22} y={y(WHEEL_R * 2)} width={22} height={WHEEL_R * 2} rx={4} fill={PALETTE.wheel} />
      ))}
      {g.articles.map((p) => (
        <g key={p.a.id}>
          {(p.a.dunnageIn ?? 0) > 0 && <rect x={p.y0 + 4} y={y(p.bottom)} width={p.a.widthIn - 8} height={p.a.dunnageIn} fill={PALETTE.dunnage} />}
          <rect x={p.y0} y={y(p.top)} width={p.a.widthIn} height={p.a.heightIn} fill={PALETTE.load} stroke={PALETTE.loadStroke} strokeWidth={fs * 0.1} />
          <text x={(p.y0 + p.y1) / 2} y={y((p.top + p.bottom) / 2)} fontSize={fs} textAnchor="middle" dominantBaseline="middle">
            {p.a.id}
          </text>
        </g>
      ))}
      {drawn}
      <Dim x1={left} x2={right} y1={-padTop + fs * 1.8} y2={-padTop + fs * 1.8} label={`width ${formatFeetInches(d.widthIn)}`} fs={fs} />
      <Dim x1={right + fs * 2} x2={right + fs * 2} y1={y(0)} y2={y(d.heightIn)} label={formatFeetInches(d.heightIn)} fs={fs} side="after" />
    </Frame>
  );
}

