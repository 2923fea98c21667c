import { Card, Tag, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { MoveSummaryDto } from '@amberline/common';
import { to } from '../../../config/paths';
import { StageTag } from '../../../components/stage-tag';
import { calendarDate } from '../format';

/** One move in the run-sheet list: where and when, and a way into its sheet. */
export function RunSheetCard({ move, next, showDriver }: { move: MoveSummaryDto; next?: boolean; showDriver?: boolean }) {
  return (
    <Link to={to.runSheet(move.id)} data-testid="run-sheet-card" style={{ display: 'block', marginBottom: 12 }}>
      <Card size="small" hoverable style={next ? { borderColor: '#d97706', borderWidth: 2 } : undefined} styles={{ body: { padding: 12 } }}>
        <div style={{ display: 'flex', justifyContent: 'space-between', gap: 8, alignItems: 'center', flexWrap: 'wrap' }}>
          <Typography.Text strong style={{ fontSize: 16 }}>
            {move.reference}
          </Typography.Text>
          <span>
            {next && (
              <Tag color="orange" data-testid="next-departure">
                next departure
              </Tag>
            )}
            <StageTag stage={move.stage} />
          </span>
        </div>
        <div style={{ fontSize: 15, marginTop: 4 }}>
          {move.origin} → {move.destination}
        </div>
        <Typography.Text type="secondary" style={{ fontSize: 13 }}>
          Departs {calendarDate(move.requestedDeparture)} · {move.commodity} for {move.customer}
          {move.jurisdictions.length ? ` · ${move.jurisdictions.join(', ')}` : ''}
          {showDriver ? ` · ${move.driver ? move.driver.name : 'no driver yet'}` : ''}
        </Typography.Text>
        {(move.flags.escorts > 0 || move.flags.superload || move.flags.permitsNeeded > 0) && (
          <div style={{ marginTop: 4 }}>
            {move.flags.permitsNeeded > 0 && <Tag>{move.flags.permitsNeeded} permit{move.flags.permitsNeeded === 1 ? '' : 's'}</Tag>}
            {move.flags.escorts > 0 && <Tag>{move.flags.escorts} escort{move.flags.escorts === 1 ? '' : 's'}</Tag>}
            {move.flags.superload && <Tag color="red">superload</Tag>}
          </div>
        )}
      </Card>
    </Link>
  );
}
