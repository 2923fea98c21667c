import { Tag, Typography } from 'antd';
import { markingLines, type MarkingLine, type MarkingsResult } from '@amberline/common';
import { CitedSource } from '../../../components/rule-source';

type SwatchKind = 'flag' | 'sign' | 'lamp-red' | 'lamp-amber';

const swatchOf = (l: MarkingLine): SwatchKind => (l.kind === 'flag' ? 'flag' : l.kind === 'sign' || l.kind === 'escort-sign' ? 'sign' : l.color === 'red' ? 'lamp-red' : 'lamp-amber');
const testIdOf = (l: MarkingLine): string => `marking-${l.kind === 'flag' ? 'flag' : l.kind === 'sign' || l.kind === 'escort-sign' ? 'sign' : 'lamp'}`;

function Swatch({ kind }: { kind: SwatchKind }) {
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

/**
 * Every flag, sign, lamp and reflector the move's states ask for, one line per item and place, with every rule
 * asking for it and its source: the same lines as the printed run sheet (both read `markingLines`).
 */
export function MarkingsList({ markings }: { markings: MarkingsResult }) {
  const lines = markingLines(markings);
  if (lines.length === 0) return <Typography.Text type="secondary">No flags, signs or lamps are asked for on this load.</Typography.Text>;
  const states = markings.jurisdictions ?? [];
  return (
    <div>
      {states.length > 1 && (
        <Typography.Paragraph type="secondary" style={{ fontSize: 12, marginBottom: 4 }}>
          Asked in every state of the move ({states.join(', ')}) unless a state is named.
        </Typography.Paragraph>
      )}
      <ul style={{ listStyle: 'none', padding: 0, margin: 0 }} data-testid="markings-list">
        {lines.map((l, n) => (
          <li key={n} style={{ display: 'flex', gap: 8, padding: '6px 0', borderTop: n ? '1px solid #f1f5f9' : undefined }} data-testid={testIdOf(l)}>
            <Swatch kind={swatchOf(l)} />
            <div style={{ minWidth: 0, fontSize: 13 }}>
              <div style={{ fontWeight: 600 }}>
                {l.where.charAt(0).toUpperCase() + l.where.slice(1)}
                {l.onlyIn && (
                  <Tag style={{ marginLeft: 6, fontWeight: 400 }} data-testid="marking-only-in">
                    {l.onlyIn} only
                  </Tag>
                )}
              </div>
              <div>{l.what}</div>
              {l.rules.map((r, k) => (
                <div key={k} data-testid="marking-rule">
                  {r.reason && <span style={{ color: '#475569' }}>{r.reason} </span>}
                  {r.asks && <span style={{ color: '#475569' }}>(asks {r.asks}) </span>}
                  {r.onlyIn && <span style={{ color: '#475569' }}>[{r.onlyIn}] </span>}
                  <CitedSource text={r.source} />
                </div>
              ))}
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
