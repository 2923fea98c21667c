import { zonedRange } from '../../../lib/time';
import { useState } from 'react';
import { Alert, App, Button, Card, Col, Empty, Row, Select, Space, Statistic, Table, Typography } from 'antd';
import type { SortOrder } from 'antd/es/table/interface';
import { Link } from 'react-router-dom';
import {
  JURISDICTIONS, PERMIT_STATUS_LABELS, PERMIT_STATUSES, PERMIT_TYPE_LABELS,
  type PermitQueueStatus, type PermitSort, type PermitSummaryDto,
} from '@amberline/common';
import { Caution } from '../../../components/caution';
import { to } from '../../../config/paths';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';
import { useAssignPermits } from '../../../features/permits/api/assign-permits';
import { useAssignees } from '../../../features/permits/api/get-assignees';
import { usePermitOverview } from '../../../features/permits/api/get-permit-overview';
import { usePermits, type PermitsFilter } from '../../../features/permits/api/get-permits';
import { useRunExpiryScan } from '../../../features/permits/api/run-expiry-scan';
import { PermitDrawer } from '../../../features/permits/components/permit-drawer';
import { NotOnFile } from '../../../components/rule-source';
import { PaymentTag, PermitStatusTag, UrgencyTag, usd } from '../../../features/permits/components/permit-tags';

const SORT_OF_COLUMN: Record<string, [PermitSort, PermitSort]> = {
  fileBy: ['urgency', 'urgency'],
  departure: ['departure', '-departure'],
  jurisdiction: ['jurisdiction', 'jurisdiction'],
  status: ['status', 'status'],
};

const order = (f: PermitsFilter, key: string): SortOrder | undefined => {
  const pair = SORT_OF_COLUMN[key];
  if (!pair) return undefined;
  if (f.sort === pair[1] && pair[0] !== pair[1]) return 'descend';
  return f.sort === pair[0] ? 'ascend' : undefined;
};

const validityText = (p: PermitSummaryDto) => {
  return zonedRange(p.validFrom, p.validTo, p.timeZone);
};

/** The permit desk: one queue across all moves, ordered by how soon each permit must be filed. */
export function PermitDeskPage() {
  const { message } = App.useApp();
  const { user } = useAuth();
  const canWork = accessFor(user?.role).canWorkPermits;
  const [filter, setFilter] = useState<PermitsFilter>({ page: 1, pageSize: 20, sort: 'urgency', status: 'open' });
  const [selected, setSelected] = useState<string[]>([]);
  const [bulkAssignee, setBulkAssignee] = useState<string | null | undefined>(undefined);
  const [open, setOpen] = useState<string | null>(null);
  const permits = usePermits(filter);
  const overview = usePermitOverview();
  const assignees = useAssignees();
  const assign = useAssignPermits();
  const scan = useRunExpiryScan();

  const set = (patch: Partial<PermitsFilter>) => setFilter((f) => ({ ...f, page: 1, ...patch }));
  const people = (assignees.data ?? []).map((a) => ({ value: a.id, label: a.name }));

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 12 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>Permit desk</Typography.Title>
        {canWork && (
          <Button
            onClick={() => scan.mutate(undefined, {
              onSuccess: (r) => message.info(r.ran ? `Checked ${r.checked} issued permits; ${r.flagged.length} newly flagged` : 'Another server is running the scan right now'),
              onError: (e) => message.error(e.message),
            })}
            loading={scan.isPending}
          >
            Check validity now
          </Button>
        )}
      </Space>
      <Caution kind="rulebook" />

      <Row gutter={[12, 12]} style={{ marginBottom: 12 }} data-testid="permit-counters">
        {PERMIT_STATUSES.filter((s) => s !== 'void').map((s) => (
          <Col key={s} xs={12} sm={8} md={4}>
            <Card size="small" hoverable onClick={() => set({ status: filter.status === s ? 'open' : s })} style={filter.status === s ? { borderColor: '#d97706' } : undefined}>
              <Statistic title={PERMIT_STATUS_LABELS[s]} value={overview.data?.counts[s] ?? 0} />
            </Card>
          </Col>
        ))}
        <Col xs={12} sm={8} md={4}>
          <Card size="small">
            <Statistic title="Overdue to file" value={overview.data?.overdue ?? 0} styles={{ content: { color: overview.data?.overdue ? '#b91c1c' : undefined } }} />
          </Card>
        </Col>
      </Row>

      <Row gutter={12} style={{ marginBottom: 12 }}>
        <Col xs={24} md={12}>
          <Card size="small" title="Expiring soon" data-testid="expiring-soon">
            <PermitList items={overview.data?.expiringSoon ?? []} empty="Nothing expires within a week" onOpen={setOpen} text={(p) => p.expiryWarning ?? `ends ${validityText(p).split(' – ')[1] ?? ''}`} />
          </Card>
        </Col>
        <Col xs={24} md={12}>
          <Card size="small" title="Needs amendment" data-testid="needs-amendment">
            <PermitList items={overview.data?.needsAmendment ?? []} empty="No permit needs an amendment" onOpen={setOpen} text={(p) => p.amendmentReason ?? ''} />
          </Card>
        </Col>
      </Row>

      <Space wrap style={{ marginBottom: 12 }}>
        <Select
          allowClear
          placeholder="Any status"
          style={{ width: 190 }}
          value={filter.status}
          onChange={(status?: PermitQueueStatus) => set({ status })}
          options={[{ value: 'open', label: 'Open (not yet issued)' }, ...PERMIT_STATUSES.map((s) => ({ value: s, label: PERMIT_STATUS_LABELS[s] }))]}
          aria-label="Status filter"
        />
        <Select allowClear showSearch placeholder="Any state" style={{ width: 170 }} value={filter.jurisdiction} onChange={(jurisdiction?: string) => set({ jurisdiction })} optionFilterProp="label" options={JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} ${j.name}` }))} aria-label="State filter" />
        <Select allowClear showSearch placeholder="Anyone" style={{ width: 200 }} value={filter.assignee} onChange={(assignee?: string) => set({ assignee })} optionFilterProp="label" options={[{ value: 'me', label: 'Assigned to me' }, { value: 'none', label: 'Unassigned' }, ...people]} aria-label="Assignee filter" />
      </Space>

      {canWork && selected.length > 0 && (
        <Alert
          type="info"
          style={{ marginBottom: 12 }}
          title={
            <Space wrap>
              <span>{selected.length} selected</span>
              <Select placeholder="Assign to" style={{ width: 220 }} value={bulkAssignee ?? undefined} onChange={(v: string) => setBulkAssignee(v)} showSearch optionFilterProp="label" options={[{ value: '__none', label: 'Nobody (unassign)' }, ...people]} aria-label="Assign to" />
              <Button
                type="primary"
                disabled={bulkAssignee === undefined}
                loading={assign.isPending}
                onClick={() =>
                  assign.mutate(
                    { permitIds: selected, assigneeId: bulkAssignee === '__none' ? null : (bulkAssignee ?? null) },
                    { onSuccess: (r) => { message.success(`${r.updated} permit(s) assigned`); setSelected([]); }, onError: (e) => message.error(e.message) },
                  )
                }
                data-testid="bulk-assign"
              >
                Assign
              </Button>
            </Space>
          }
        />
      )}

      <Table<PermitSummaryDto>
        rowKey="id"
        size="middle"
        loading={permits.isFetching}
        dataSource={permits.data?.items}
        scroll={{ x: 1200 }}
        rowSelection={canWork ? { selectedRowKeys: selected, onChange: (keys) => setSelected(keys as string[]) } : undefined}
        onRow={(p) => ({ onDoubleClick: () => setOpen(p.id) })}
        pagination={{ current: filter.page, pageSize: filter.pageSize, total: permits.data?.total, showSizeChanger: true, showTotal: (n) => `${n} permit${n === 1 ? "" : "s"}` }}
        onChange={(pg, _filters, sorter) => {
          const s = Array.isArray(sorter) ? sorter[0] : sorter;
          const pair = s?.columnKey ? SORT_OF_COLUMN[String(s.columnKey)] : undefined;
          const sort: PermitSort = pair && s.order ? (s.order === 'descend' ? pair[1] : pair[0]) : 'urgency';
          setFilter((f) => ({ ...f, page: sort !== f.sort || pg.pageSize !== f.pageSize ? 1 : (pg.current ?? 1), pageSize: pg.pageSize ?? f.pageSize, sort }));
        }}
        columns={[
          { key: 'fileBy', title: 'Urgency', sorter: true, sortOrder: order(filter, 'fileBy'), render: (_: unknown, p) => (
            <>
              <UrgencyTag urgency={p.urgency} daysToFileBy={p.daysToFileBy} fileBy={p.fileBy} />
              {p.leadTimeDays === null && (
                <div style={{ marginTop: 2 }}>
                  <NotOnFile what="The state's lead time is not on file: the file-by date is the departure itself">lead time not on file</NotOnFile>
                </div>
              )}
            </>
          ) },
          { key: 'move', title: 'Move', render: (_: unknown, p) => <span><Link to={to.move(p.moveId)}>{p.moveReference}</Link><div><Typography.Text type="secondary">{p.customer}</Typography.Text></div></span> },
          { key: 'jurisdiction', title: 'State', sorter: true, sortOrder: order(filter, 'jurisdiction'), render: (_: unknown, p) => <Button type="link" size="small" onClick={() => setOpen(p.id)} data-testid={`desk-open-${p.moveReference}-${p.jurisdiction}`}>{p.jurisdictionName}</Button> },
          { key: 'type', title: 'Type', render: (_: unknown, p) => PERMIT_TYPE_LABELS[p.permitType] },
          { key: 'status', title: 'Status', sorter: true, sortOrder: order(filter, 'status'), render: (_: unknown, p) => <PermitStatusTag status={p.status} /> },
          { key: 'number', title: 'Number', render: (_: unknown, p) => p.permitNumber ?? '—' },
          { key: 'departure', title: 'Departs', sorter: true, sortOrder: order(filter, 'departure'), render: (_: unknown, p) => p.departure },
          { key: 'validity', title: 'Valid (state time)', render: (_: unknown, p) => <span>{validityText(p)}{p.expiryWarning && <div><Typography.Text type="danger">{p.expiryWarning}</Typography.Text></div>}</span> },
          { key: 'fee', title: 'Fee', render: (_: unknown, p) => (p.actualFeeUsd !== null ? usd(p.actualFeeUsd) : p.estimatedFeeUsd !== null ? `${usd(p.estimatedFeeUsd)} est.` : <NotOnFile>fee unknown</NotOnFile>) },
          { key: 'pdf', title: 'PDF', render: (_: unknown, p) => (p.documentCount ? `${p.documentCount} version${p.documentCount > 1 ? 's' : ''}` : '—') },
          { key: 'paid', title: 'Payment', render: (_: unknown, p) => <PaymentTag status={p.paymentStatus} /> },
          { key: 'assignee', title: 'Assignee', render: (_: unknown, p) => p.assignee?.name ?? <Typography.Text type="secondary">unassigned</Typography.Text> },
        ]}
      />
      <Typography.Paragraph type="secondary">File-by date = departure minus the state's lead time from the rulebook. Double-click a row or click the state to open the permit.</Typography.Paragraph>
      <PermitDrawer permitId={open} onClose={() => setOpen(null)} />
    </div>
  );
}

/** A short list of permits with one line each and an Open button. */
function PermitList({ items, empty, text, onOpen }: { items: PermitSummaryDto[]; empty: string; text: (p: PermitSummaryDto) => string; onOpen: (id: string) => void }) {
  if (!items.length) return <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description={empty} />;
  return (
    <div>
      {items.map((p) => (
        <div key={p.id} style={{ display: 'flex', justifyContent: 'space-between', alignItems: 'center', padding: '4px 0', borderBottom: '1px solid #e2e8f0' }}>
          <span>
            <strong>{p.jurisdiction}</strong> · <Link to={to.move(p.moveId)}>{p.moveReference}</Link> · {text(p)}
          </span>
          <Button size="small" type="link" onClick={() => onOpen(p.id)}>Open</Button>
        </div>
      ))}
    </div>
  );
}
