/**
 * The drawings' marks: flags, lamps, signs, dimension lines and the frame of one view. `variant` picks the plan's
 * proportions and test ids (`diagram-…`) or the run sheet's (`run-sheet-…`).
 */
import type { ReactNode } from 'react';
import { PALETTE } from './palette';

export type MarkVariant = 'plan' | 'sheet';
const PREFIX: Record<MarkVariant, string> = { plan: 'diagram', sheet: 'run-sheet' };

const FLAG: Record<MarkVariant, { mast: number; reach: number; sway: number; stem: number; edge: number }> = {
  plan: { mast: 1.6, reach: 1, sway: 1.25, stem: 0.08, edge: 0.04 },
  sheet: { mast: 1.7, reach: 1.1, sway: 1.3, stem: 0.1, edge: 0.05 },
};

/** A flag on its staff, standing at (x, y) and blowing toward `dir`. */
export function Flag({ x, y, fs, title, dir = 1, variant = 'plan' }: { x: number; y: number; fs: number; title: string; dir?: 1 | -1; variant?: MarkVariant }) {
  const s = fs * 0.9;
  const f = FLAG[variant];
  return (
    <g data-testid={`${PREFIX[variant]}-flag`}>
      <title>{title}</title>
      <line x1={x} y1={y} x2={x} y2={y - s * f.mast} stroke={PALETTE.ink} strokeWidth={fs * f.stem} />
      <polygon points={`${x},${y - s * f.mast} ${x + dir * s * f.reach},${y - s * f.sway} ${x},${y - s * 0.9}`} fill={PALETTE.flag} stroke={PALETTE.ink} strokeWidth={fs * f.edge} />
    </g>
  );
}

/** A lamp: a red or amber dot. */
export function Lamp({ x, y, fs, red, title, variant = 'plan' }: { x: number; y: number; fs: number; red: boolean; title: string; variant?: MarkVariant }) {
  const plan = variant === 'plan';
  return (
    <g data-testid={`${PREFIX[variant]}-lamp`}>
      <title>{title}</title>
      <circle cx={x} cy={y} r={fs * (plan ? 0.35 : 0.42)} fill={red ? PALETTE.red : PALETTE.amber} stroke={PALETTE.ink} strokeWidth={fs * (plan ? 0.05 : 0.06)} />
    </g>
  );
}

/** A sign board centered on (x, y), with its words when there is room for them. */
export function Sign({ x, y, w, h, fs, text, title, variant = 'plan', edge = 0.06 }: { x: number; y: number; w: number; h: number; fs: number; text?: string; title: string; variant?: MarkVariant; edge?: number }) {
  const plan = variant === 'plan';
  return (
    <g data-testid={`${PREFIX[variant]}-sign`}>
      <title>{title}</title>
      <rect x={x - w / 2} y={y - h / 2} width={w} height={h} fill={PALETTE.sign} stroke={PALETTE.ink} strokeWidth={fs * edge} />
      {text && (
        <text x={x} y={y} fontSize={plan ? Math.min(h * 0.7, fs * 0.8) : Math.min(h * 0.55, fs * 0.75)} textAnchor="middle" dominantBaseline={plan ? 'middle' : 'central'} fontWeight={700} fill={PALETTE.ink}>
          {text}
        </text>
      )}
    </g>
  );
}

type DimProps = {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  label: string;
  fs: number;
  testId?: string;
  /** Plan: the label before (above, left of) or after (below, right of) the line. */
  side?: 'before' | 'after';
  /** Sheet: the label at the line's middle moved by dx, dy and anchored so. */
  anchor?: 'start' | 'middle' | 'end';
  dx?: number;
  dy?: number;
  variant?: MarkVariant;
};

/** A dimension line with end ticks and its label; horizontal or vertical, in the view's own coordinates. */
export function Dim({ x1, y1, x2, y2, label, fs, testId, side = 'before', anchor = 'middle', dx = 0, dy = 0, variant = 'plan' }: DimProps) {
  const vertical = Math.abs(x2 - x1) < Math.abs(y2 - y1);
  const t = fs * (variant === 'plan' ? 0.5 : 0.45);
  const mx = (x1 + x2) / 2;
  const my = (y1 + y2) / 2;
  const after = side === 'after';
  const text =
    variant === 'sheet' ? (
      <text x={mx + dx} y={my + dy} fontSize={fs} stroke="none" textAnchor={anchor} dominantBaseline="central">
        {label}
      </text>
    ) : vertical ? (
      <text x={after ? mx + t * 1.4 : mx - t * 1.4} y={my} fontSize={fs} stroke="none" textAnchor={after ? 'start' : 'end'} dominantBaseline="middle">
        {label}
      </text>
    ) : (
      <text x={mx} y={after ? my + fs * 1.1 : my - fs * 0.4} fontSize={fs} stroke="none" textAnchor="middle">
        {label}
      </text>
    );
  return (
    <g data-testid={testId} stroke={PALETTE.dim} fill={PALETTE.dim}>
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
      {text}
    </g>
  );
}

/** One view: its caption and its drawing. */
export function Frame({ title, viewBox, testId, children, maxWidth }: { title: string; viewBox: string | readonly number[]; testId: string; children: ReactNode; maxWidth?: number }) {
  return (
    <figure style={{ margin: '0 0 12px' }}>
      <figcaption style={{ fontSize: 12, color: PALETTE.muted, marginBottom: 2 }}>{title}</figcaption>
      <svg
        viewBox={typeof viewBox === 'string' ? viewBox : viewBox.join(' ')}
        width="100%"
        role="img"
        aria-label={title}
        data-testid={testId}
        style={{ display: 'block', maxWidth, background: PALETTE.paper, border: `1px solid ${PALETTE.border}`, borderRadius: 4 }}
      >
        {children}
      </svg>
    </figure>
  );
}
