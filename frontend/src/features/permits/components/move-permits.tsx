import { zonedRange } from '../../../lib/time';
import { useState } from 'react';
import { Alert, App, Button, Space, Table, Typography } from 'antd';
import type { PermitDto } from '@amberline/common';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';
import { downloadPermitDocument } from '../api/download-file';
import { useMovePermits } from '../api/get-move-permits';
import { useSyncMovePermits } from '../api/sync-move-permits';
import { PermitDrawer } from './permit-drawer';
import { PaymentTag, PermitStatusTag, usd } from './permit-tags';

/** The permits of one move, shown on the move page: status, validity, fee, PDFs; create them from the assessment. */
export function MovePermits({ moveId }: { moveId: string }) {
  const { message } = App.useApp();
  const { user } = useAuth();
  const canSync = user?.role === 'admin' || user?.role === 'dispatcher' || user?.role === 'permit_clerk';
  const canOpen = accessFor(user?.role).canSeePermitDesk;
  const permits = useMovePermits(moveId);
  const sync = useSyncMovePermits();
  const [open, setOpen] = useState<string | null>(null);

  if (permits.isError) return <Alert type="error" showIcon title={permits.error.message} />;
  const rows = (permits.data ?? []).filter((p) => p.status !== 'void' || p.payments.length > 0);
  return (
    <div data-testid="move-permits">
      {canSync && (
        <Space style={{ marginBottom: 12 }} wrap>
          <Button
            onClick={() =>
              sync.mutate(moveId, {
                onSuccess: (r) => message.success(r.created || r.updated ? `${r.created} permit(s) created, ${r.updated} updated from the assessment` : 'Permits already follow the assessment'),
                onError: (e) => message.error(e.message),
              })
            }
            loading={sync.isPending}
            data-testid="permits-sync"
          >
            Create permits from assessment
          </Button>
          <Typography.Text type="secondary">One permit per state that needs one; a later plan change flags issued permits for amendment.</Typography.Text>
        </Space>
      )}
      <Table<PermitDto>
        size="small"
        rowKey="id"
        loading={permits.isPending}
        pagination={false}
        dataSource={rows}
        locale={{ emptyText: 'No permits yet' }}
        scroll={{ x: 800 }}
        columns={[
          { title: 'State', dataIndex: 'jurisdiction', render: (c: string, p) => (canOpen ? <Button type="link" size="small" onClick={() => setOpen(p.id)} data-testid={`open-permit-${c}`}>{p.jurisdictionName}</Button> : p.jurisdictionName) },
          { title: 'Status', dataIndex: 'status', render: (s: PermitDto['status']) => <PermitStatusTag status={s} /> },
          { title: 'Number', dataIndex: 'permitNumber', render: (v: string | null) => v ?? '—' },
          { title: 'Valid', render: (_: unknown, p) => zonedRange(p.validFrom, p.validTo, p.timeZone) },
          { title: 'Fee', render: (_: unknown, p) => (p.actualFeeUsd === null && p.estimatedFeeUsd === null ? 'unknown (not on file)' : `${usd(p.actualFeeUsd ?? p.estimatedFeeUsd)}${p.actualFeeUsd === null ? ' est.' : ''}`) },
          { title: 'Payment', dataIndex: 'paymentStatus', render: (s: PermitDto['paymentStatus']) => <PaymentTag status={s} /> },
          {
            title: 'PDF',
            render: (_: unknown, p) =>
              p.documents.length ? (
                <Button type="link" size="small" onClick={() => downloadPermitDocument(p.id, p.documents[0].id, p.documents[0].fileName).catch((e: Error) => message.error(e.message))}>
                  v{p.documents[0].version} {p.documents[0].fileName}
                </Button>
              ) : (
                '—'
              ),
          },
        ]}
        expandable={{
          rowExpandable: (p) => !!p.amendmentReason || !!p.expiryWarning,
          expandedRowRender: (p) => <Typography.Text type="warning">{p.amendmentReason ?? p.expiryWarning}</Typography.Text>,
        }}
      />
      {canOpen && <PermitDrawer permitId={open} onClose={() => setOpen(null)} />}
    </div>
  );
}
