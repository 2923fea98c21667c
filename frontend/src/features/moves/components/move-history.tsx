import { Empty, Spin, Timeline, Typography } from 'antd';
import { formatFeetInches, formatPounds, MOVE_STAGE_LABELS, type HistoryEntryDto, type MoveArticle, type MoveStage, type RouteSegmentInput } from '@amberline/common';
import dayjs from 'dayjs';
import { useMoveHistory } from '../api/get-history';

const FIELD_LABELS: Record<string, string> = {
  customer: 'Customer',
  customerRef: 'Customer reference',
  commodity: 'Commodity',
  stage: 'Stage',
  tractorId: 'Tractor',
  trailerId: 'Trailer',
  driverId: 'Driver',
  sliderSettingFt: 'Sliding axle',
  articles: 'Load pieces',
  route: 'Route',
  origin: 'Origin',
  destination: 'Destination',
  requestedDeparture: 'Departure',
  travelDays: 'Travel days',
  notes: 'Notes',
  ruleVersions: 'Rule versions used',
  differences: 'What changed',
};

const ACTION_LABELS: Record<string, string> = { created: 'Move opened', updated: 'Move edited', stage: 'Stage changed', reopened: 'Move reopened', reassessed: 'Re-assessed with current rules' };

function show(key: string, v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (key === 'stage' && typeof v === 'string') return MOVE_STAGE_LABELS[v as MoveStage] ?? v;
  if (key === 'sliderSettingFt' && typeof v === 'number') return `${v} ft behind the kingpin`;
  if (key === 'articles' && Array.isArray(v)) {
    return (v as MoveArticle[])
      .map((a) => {
        try {
          return `${a.id}: ${formatFeetInches(a.lengthIn)} × ${formatFeetInches(a.widthIn)} × ${formatFeetInches(a.heightIn)}, ${formatPounds(a.weightLb)}, ${a.tiedowns?.length ?? 0} tiedowns`;
        } catch {
          return String(a.id);
        }
      })
      .join('; ');
  }
  if (key === 'route' && Array.isArray(v)) return (v as RouteSegmentInput[]).map((s) => `${s.jurisdiction} ${s.roads} (${s.miles} mi, ${s.roadType})`).join(' → ');
  if (key === 'differences' && Array.isArray(v)) return v.length ? v.join('; ') : 'nothing a user acts on';
  if (key === 'ruleVersions' && typeof v === 'object') return Object.entries(v as Record<string, number>).map(([c, n]) => `${c} v${n}`).join(', ');
  if (typeof v === 'object') {
    const s = JSON.stringify(v);
    return s.length > 160 ? `${s.slice(0, 157)}…` : s;
  }
  return String(v);
}

function Changes({ e }: { e: HistoryEntryDto }) {
  const before = (e.before ?? {}) as Record<string, unknown>;
  const after = (e.after ?? {}) as Record<string, unknown>;
  if (e.action === 'created') {
    return <Typography.Text type="secondary">{show('articles', after.articles)}</Typography.Text>;
  }
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
  return (
    <ul style={{ margin: '2px 0', paddingLeft: 18 }}>
      {keys.map((k) => (
        <li key={k} data-testid="history-change">
          <Typography.Text strong>{FIELD_LABELS[k] ?? k}</Typography.Text>: {k in before ? <>{show(k, before[k])} → </> : null}
          {show(k, after[k])}
        </li>
      ))}
    </ul>
  );
}

/** The audit trail of one move: who changed what, when, before → after, and why. */
export function MoveHistory({ moveId }: { moveId: string }) {
  const history = useMoveHistory(moveId);
  if (history.isPending) return <Spin />;
  if (history.isError) return <Typography.Text type="danger">{history.error.message}</Typography.Text>;
  if (history.data.length === 0) return <Empty description="No entries yet" />;
  return (
    <Timeline
      data-testid="move-history"
      items={[...history.data].reverse().map((e) => ({
        key: e.id,
        color: e.action === 'stage' ? 'blue' : e.action === 'created' ? 'green' : 'gray',
        content: (
          <div data-testid="history-entry">
            <div>
              <Typography.Text strong>{ACTION_LABELS[e.action] ?? `${e.entity} ${e.action}`}</Typography.Text>
              <Typography.Text type="secondary">
                {' '}
                by {e.actor?.name ?? 'the system'}, {dayjs(e.at).format('D MMM YYYY HH:mm')}
              </Typography.Text>
            </div>
            <Changes e={e} />
            {e.reason && <div>Reason: {e.reason}</div>}
          </div>
        ),
      }))}
    />
  );
}
