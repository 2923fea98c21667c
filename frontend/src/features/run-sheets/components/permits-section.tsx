import { Alert, Tag, Typography } from 'antd';
import type { RunSheetPermit } from '@amberline/common';
import { calendarDate } from '../format';

export function PermitsSection({ permits }: { permits: RunSheetPermit[] }) {
  if (permits.length === 0) {
    return (
      <Typography.Text type="secondary" data-testid="permits-empty">
        No permits are recorded on this move yet. Do not leave without the permit for each state on board; ask your dispatcher.
      </Typography.Text>
    );
  }
  return (
    <div data-testid="permits-list">
      {permits.map((p, i) => (
        <div key={`${p.jurisdiction}${i}`} style={{ padding: '8px 0', borderTop: i ? '1px solid #f1f5f9' : undefined }} data-testid="run-sheet-permit">
          <div style={{ display: 'flex', gap: 8, alignItems: 'center', flexWrap: 'wrap' }}>
            <Typography.Text strong>{p.jurisdiction}</Typography.Text>
            <Typography.Text code data-testid="permit-number">
              {p.number ?? 'number not recorded'}
            </Typography.Text>
            <Tag>{p.status.replace(/_/g, ' ')}</Tag>
          </div>
          <div style={{ fontSize: 13 }}>
            Valid {p.validFrom ? calendarDate(p.validFrom) : '—'} to {p.validTo ? calendarDate(p.validTo) : '—'}
          </div>
          {p.warning && <Alert type="error" showIcon style={{ margin: '6px 0' }} title={p.warning} data-testid="permit-warning" />}
          {p.conditions.length > 0 && (
            <ul style={{ margin: '4px 0', paddingInlineStart: 18, fontSize: 13 }}>
              {p.conditions.map((c, k) => (
                <li key={k}>{c}</li>
              ))}
            </ul>
          )}
          {p.documentUrl ? (
            <a href={p.documentUrl} target="_blank" rel="noreferrer" className="no-print">
              Open the permit PDF
            </a>
          ) : (
            <Typography.Text type="secondary" style={{ fontSize: 12 }}>
              No permit document attached.
            </Typography.Text>
          )}
        </div>
      ))}
    </div>
  );
}
