import { formatPounds, type AxleCheckResult, type AxleGroupCheck, type AxleInput } from '@amberline/common';

export type AxleBar = {
  key: string;
  label: string;
  weightLb: number;
  /** The most restrictive limit found for the group; null when none applies. */
  limitLb: number | null;
  rule?: string;
  source?: string;
};

const RULE_WORDS: Record<AxleGroupCheck['rule'], string> = {
  single: 'single axle',
  tandem: 'tandem',
  'bridge-formula': 'bridge formula',
  'two-tandem-exception': 'two tandems',
  gross: 'gross',
};

/**
 * Steer, drive group, trailer group and gross, each with the lowest limit the check applied to exactly that
 * run of axles. `driveAxles` and `trailerAxles` are the counts in each group.
 */
export function axleBars(axles: AxleInput[], check: AxleCheckResult, driveAxles: number, trailerAxles: number): AxleBar[] {
  const n = axles.length;
  const runs: { key: string; label: string; from: number; to: number; gross?: boolean }[] = [
    { key: 'steer', label: 'Steer axle', from: 1, to: 1 },
    { key: 'drive', label: driveAxles === 1 ? 'Drive axle' : `Drive group (${driveAxles})`, from: 2, to: 1 + driveAxles },
    { key: 'trailer', label: trailerAxles === 1 ? 'Trailer axle' : `Trailer group (${trailerAxles})`, from: 2 + driveAxles, to: 1 + driveAxles + trailerAxles },
    { key: 'gross', label: 'Gross', from: 1, to: n, gross: true },
  ];
  return runs
    .filter((r) => r.to <= n && r.from <= r.to)
    .map((r) => {
      const weight = axles.slice(r.from - 1, r.to).reduce((s, a) => s + a.weightLb, 0);
      const checks = check.groups.filter((g) => g.fromAxle === r.from && g.toAxle === r.to && (r.gross ? g.rule === 'gross' || g.rule === 'bridge-formula' : g.rule !== 'gross'));
      const governing = checks.reduce<AxleGroupCheck | null>((best, g) => (!best || g.limitLb < best.limitLb ? g : best), null);
      return {
        key: r.key,
        label: r.label,
        weightLb: weight,
        limitLb: governing?.limitLb ?? null,
        ...(governing ? { rule: RULE_WORDS[governing.rule], source: governing.source } : {}),
      };
    });
}

/** Horizontal bars of axle-group weights against their limits; the limit sits at the same place on every bar. */
export function AxleChart({ bars, title }: { bars: AxleBar[]; title?: string }) {
  const W = 500;
  const labelW = 128;
  const valueW = 150;
  const barW = W - labelW - valueW - 16;
  const rowH = 34;
  const limitAt = barW / 1.5; // the limit at two thirds of the bar: up to 150 % shows
  const H = bars.length * rowH + 24;
  return (
    <figure style={{ margin: 0 }} data-testid="axle-chart">
      {title && <figcaption style={{ fontWeight: 600, marginBottom: 4 }}>{title}</figcaption>}
      <svg viewBox={`0 0 ${W} ${H}`} width="100%" role="img" aria-label="Axle-group weights against their limits" style={{ maxWidth: W, display: 'block' }}>
        {bars.map((b, i) => {
          const y = i * rowH + 4;
          const ratio = b.limitLb ? b.weightLb / b.limitLb : 0;
          const over = b.limitLb !== null && b.weightLb > b.limitLb + 0.5;
          const len = b.limitLb ? Math.min(barW, limitAt * ratio) : 0;
          return (
            <g key={b.key} data-testid={`axle-bar-${b.key}`} data-over={over ? 'true' : 'false'}>
              <title>{`${b.label}: ${formatPounds(b.weightLb)}${b.limitLb ? ` against ${formatPounds(b.limitLb)} (${b.rule})` : ''}${b.source ? ` — ${b.source}` : ''}`}</title>
              <text x={0} y={y + 17} fontSize={13} fill="#0f172a">
                {b.label}
              </text>
              <rect x={labelW} y={y + 4} width={barW} height={18} fill="#f1f5f9" rx={3} />
              <rect x={labelW} y={y + 4} width={Math.max(len, 1)} height={18} fill={over ? '#b91c1c' : ratio > 0.95 ? '#d97706' : '#15803d'} rx={3} />
              {b.limitLb !== null && <line x1={labelW + limitAt} x2={labelW + limitAt} y1={y} y2={y + 26} stroke="#0f172a" strokeWidth={2} />}
              <text x={labelW + barW + 8} y={y + 17} fontSize={12} fill={over ? '#b91c1c' : '#334155'} fontWeight={over ? 700 : 400}>
                {formatPounds(b.weightLb)}
                {b.limitLb !== null ? ` / ${formatPounds(b.limitLb).replace(' lb', '')}` : ''}
              </text>
            </g>
          );
        })}
        <text x={labelW + limitAt} y={H - 4} fontSize={11} textAnchor="middle" fill="#475569">
          limit
        </text>
      </svg>
    </figure>
  );
}
