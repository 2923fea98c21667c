import { Alert, Tag, Typography } from 'antd';
import { ANCHOR_KIND_LABELS, type AnchorKind, type MoveTiedown, type RunSheetDto } from '@amberline/common';
import { lb } from '../format';

/** Identical tiedowns once, with their count: "6 × 1/2 in grade 70 chain, side to side to the winch track, 6,600 lb each". */
function groupTiedowns(tiedowns: MoveTiedown[], credited: number[]): { text: string; count: number }[] {
  const groups = new Map<string, number>();
  tiedowns.forEach((t, k) => {
    const what = t.kind === 'chain' ? `${t.chainSize ?? ''} in grade ${t.chainGrade ?? 30} chain` : t.kind === 'webbing' ? `${t.webbingWidth ?? ''} in webbing` : 'tiedown';
    const marked = t.markedWllLb ? `, marked ${lb(t.markedWllLb)}` : '';
    const text = `${what}${marked}, ${t.path.replace(/-/g, ' ')} to the ${(ANCHOR_KIND_LABELS[t.anchorKind] ?? t.anchorKind).toLowerCase()}${
      credited[k] !== undefined ? `, credited ${lb(credited[k])} each` : ''
    }${t.edgeProtection ? ', with edge protection' : ''}`;
    groups.set(text, (groups.get(text) ?? 0) + 1);
  });
  return [...groups].map(([text, count]) => ({ text, count }));
}

/** Per piece: tiedowns required and planned, aggregate WLL against the requirement, anchors, edge protection. */
export function SecurementSection({ sheet }: { sheet: RunSheetDto }) {
  if (sheet.securement.length === 0) return <Typography.Text type="secondary">No securement on this move.</Typography.Text>;
  return (
    <div data-testid="securement">
      {sheet.securement.map((s) => {
        const art = sheet.move.articles.find((a) => a.id === s.articleId);
        const anchors = [...new Set((art?.tiedowns ?? []).map((t) => t.anchorKind))];
        const needsEdge = art?.sharpEdges || (art?.tiedowns ?? []).some((t) => t.edgeProtection);
        return (
          <div key={s.articleId} style={{ padding: '8px 0', borderTop: '1px solid #f1f5f9' }} data-testid="securement-piece">
            <div style={{ display: 'flex', gap: 8, alignItems: 'center', flexWrap: 'wrap' }}>
              <Typography.Text strong>
                {s.articleId}
                {art?.description ? ` · ${art.description}` : ''}
              </Typography.Text>
              <Tag color={s.ok ? 'green' : 'red'}>{s.ok ? 'meets the plan check' : 'short of the requirement'}</Tag>
            </div>
            <div style={{ fontSize: 13 }}>
              Tiedowns: <strong>{s.count}</strong> planned, at least <strong>{s.requiredCount}</strong> required
            </div>
            <div style={{ fontSize: 13 }}>
              Aggregate WLL: <strong>{lb(s.aggregateLb)}</strong> credited, at least <strong>{lb(s.requiredAggregateLb)}</strong> required
            </div>
            {anchors.length > 0 && (
              <div style={{ fontSize: 13 }}>
                Anchors:{' '}
                {anchors.map((k) => ANCHOR_KIND_LABELS[k as AnchorKind] ?? k).join(', ')}. The lower of the tiedown&apos;s and the anchor&apos;s rating counts.
              </div>
            )}
            {art && art.tiedowns.length > 0 && (
              <ul style={{ margin: '4px 0', paddingInlineStart: 20, fontSize: 13, color: '#334155' }} data-testid="tiedown-groups">
                {groupTiedowns(art.tiedowns, s.credited).map((g) => (
                  <li key={g.text}>
                    <strong>{g.count} ×</strong> {g.text}
                  </li>
                ))}
              </ul>
            )}
            {needsEdge && <div style={{ fontSize: 13 }}>Edge protection wherever a tiedown crosses an edge that could cut or wear it.</div>}
            {s.findings.map((f, k) => (
              <Alert key={k} type={s.ok ? 'warning' : 'error'} showIcon style={{ marginTop: 4 }} title={f} />
            ))}
          </div>
        );
      })}
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, margin: '6px 0 0' }}>
        Re-check tension after the first miles and at every stop. 49 CFR 393.100–393.136; the permit and licensed practice govern.
      </Typography.Paragraph>
    </div>
  );
}
