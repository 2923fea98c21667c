import { Tag, Typography } from 'antd';
import type { RunSheetEscort } from '@amberline/common';
import { localInstant } from '../format';

export function EscortsSection({ escorts }: { escorts: RunSheetEscort[] }) {
  if (escorts.length === 0) {
    return (
      <Typography.Text type="secondary" data-testid="escorts-empty">
        No escorts are booked on this move.
      </Typography.Text>
    );
  }
  return (
    <div data-testid="escorts-list">
      {escorts.map((e, i) => (
        <div key={i} style={{ padding: '8px 0', borderTop: i ? '1px solid #f1f5f9' : undefined }} data-testid="run-sheet-escort">
          <div style={{ display: 'flex', gap: 8, alignItems: 'center', flexWrap: 'wrap' }}>
            <Typography.Text strong>{e.position.replace(/_/g, ' ')}</Typography.Text>
            {e.jurisdiction && <Tag>{e.jurisdiction}</Tag>}
            <Tag color={e.status === 'confirmed' ? 'green' : 'default'}>{e.status.replace(/_/g, ' ')}</Tag>
          </div>
          <div style={{ fontSize: 13 }}>
            {e.vendor ?? 'vendor not yet known'}
            {e.operator ? ` · ${e.operator}` : ''}
          </div>
          {e.phone && (
            <a href={`tel:${e.phone.replace(/[^\d+]/g, '')}`} style={{ fontSize: 15 }} data-testid="escort-phone">
              {e.phone}
            </a>
          )}
          {(e.meetingPoint || e.meetingTime) && (
            <div style={{ fontSize: 13 }}>
              Meet {e.meetingPoint ? `at ${e.meetingPoint}` : ''}
              {e.meetingTime ? `, ${/^\d{4}-\d{2}-\d{2}T/.test(e.meetingTime) ? localInstant(e.meetingTime) : e.meetingTime}` : ''}
            </div>
          )}
        </div>
      ))}
    </div>
  );
}
