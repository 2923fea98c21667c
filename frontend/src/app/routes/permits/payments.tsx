import { useState } from 'react';
import { App, Button, Card, Col, Row, Select, Space, Statistic, Table, Typography } from 'antd';
import { Link } from 'react-router-dom';
import { JURISDICTIONS, PAYMENT_STATUS_LABELS, PAYMENT_STATUSES, type PaymentDto, type PaymentStatus } from '@amberline/common';
import { to } from '../../../config/paths';
import { downloadPaymentsCsv, usePayments, type PaymentsFilter } from '../../../features/permits/api/get-payments';
import { PaymentTag, usd } from '../../../features/permits/components/permit-tags';

/** The payments ledger: every attempt to pay a permit fee, with the processor's ids, and a CSV export. */
export function PaymentsPage() {
  const { message } = App.useApp();
  const [filter, setFilter] = useState<PaymentsFilter>({ page: 1, pageSize: 20 });
  const [downloading, setDownloading] = useState(false);
  const payments = usePayments(filter);
  const set = (patch: Partial<PaymentsFilter>) => setFilter((f) => ({ ...f, page: 1, ...patch }));
  const { page: _p, pageSize: _s, ...csvFilter } = filter;
  void _p;
  void _s;

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 12 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>Payments</Typography.Title>
        <Button
          onClick={() => {
            setDownloading(true);
            downloadPaymentsCsv(csvFilter).catch((e: Error) => message.error(e.message)).finally(() => setDownloading(false));
          }}
          loading={downloading}
          data-testid="payments-csv"
        >
          Download CSV
        </Button>
      </Space>
      <Row gutter={12} style={{ marginBottom: 12 }}>
        <Col xs={12} md={6}><Card size="small"><Statistic title="Paid" value={usd(payments.data?.totals.succeededUsd ?? 0)} /></Card></Col>
        <Col xs={12} md={6}><Card size="small"><Statistic title="Refunded" value={usd(payments.data?.totals.refundedUsd ?? 0)} /></Card></Col>
        <Col xs={12} md={6}><Card size="small"><Statistic title="Attempts" value={payments.data?.total ?? 0} /></Card></Col>
      </Row>
      <Space wrap style={{ marginBottom: 12 }}>
        <Select allowClear placeholder="Any status" style={{ width: 190 }} value={filter.status} onChange={(status?: PaymentStatus) => set({ status })} options={PAYMENT_STATUSES.map((s) => ({ value: s, label: PAYMENT_STATUS_LABELS[s] }))} aria-label="Payment status filter" />
        <Select allowClear showSearch placeholder="Any state" style={{ width: 170 }} value={filter.jurisdiction} onChange={(jurisdiction?: string) => set({ jurisdiction })} optionFilterProp="label" options={JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} ${j.name}` }))} aria-label="State filter" />
      </Space>
      <Table<PaymentDto>
        rowKey="id"
        size="middle"
        loading={payments.isFetching}
        dataSource={payments.data?.items}
        scroll={{ x: 1100 }}
        pagination={{ current: filter.page, pageSize: filter.pageSize, total: payments.data?.total, showSizeChanger: true, onChange: (page, pageSize) => setFilter((f) => ({ ...f, page, pageSize })) }}
        columns={[
          { title: 'Date', dataIndex: 'createdAt', render: (v: string) => new Date(v).toLocaleString() },
          { title: 'Move', dataIndex: 'moveReference', render: (v: string, p) => <Link to={to.move(p.moveId)}>{v}</Link> },
          { title: 'State', dataIndex: 'jurisdiction' },
          { title: 'Permit', dataIndex: 'permitNumber', render: (v: string | null) => v ?? '—' },
          { title: 'Amount', dataIndex: 'amountUsd', align: 'right', render: (v: number) => usd(v) },
          { title: 'Status', dataIndex: 'status', render: (s: PaymentStatus, p) => <span><PaymentTag status={s} />{p.failureMessage && <div><Typography.Text type="danger">{p.failureMessage}</Typography.Text></div>}</span> },
          { title: 'Attempt', dataIndex: 'attempt' },
          { title: 'Payment intent', dataIndex: 'stripePaymentIntentId', render: (v: string | null) => <Typography.Text code copyable={!!v}>{v ?? '—'}</Typography.Text> },
          { title: 'Charge / refund', render: (_: unknown, p) => <Typography.Text code>{p.stripeRefundId ?? p.stripeChargeId ?? '—'}</Typography.Text> },
        ]}
      />
      <Typography.Paragraph type="secondary">Test mode: payments go to the local payment processor stand-in; no real card is charged.</Typography.Paragraph>
    </div>
  );
}
