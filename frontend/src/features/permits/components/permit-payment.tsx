/** A permit's fee: paying it with the processor, its payments, and the refund of a voided permit's fee. */
import { useMemo, useState } from 'react';
import { Alert, App, Button, Radio, Space, Table, Typography } from 'antd';
import { TEST_PAYMENT_METHODS, type PaymentDto, type PermitDto } from '@amberline/common';
import { newAttemptKey, usePayPermit } from '../api/pay-permit';
import { useRefundPermit } from '../api/refund-permit';
import { localText, PaymentTag, usd } from './permit-tags';

export function PermitPayment({ p, canWork }: { p: PermitDto; canWork: boolean }) {
  const { message } = App.useApp();
  const pay = usePayPermit();
  const refund = useRefundPermit();
  const [method, setMethod] = useState(TEST_PAYMENT_METHODS[0].id);
  const [attemptKey, setAttemptKey] = useState(newAttemptKey);
  const [last, setLast] = useState<PaymentDto | null>(null);
  const paid = p.payments.find((x) => x.status === 'succeeded');
  const inFlight = p.payments.find((x) => x.status === 'processing' || x.status === 'pending');
  const latest = useMemo(() => last ?? p.payments[0] ?? null, [last, p.payments]);
  const canPay = canWork && p.status === 'issued' && !paid && !inFlight;

  const submit = () =>
    pay.mutate(
      { permitId: p.id, paymentMethod: method, idempotencyKey: attemptKey },
      {
        onSuccess: (r) => {
          setLast(r);
          setAttemptKey(newAttemptKey()); // the next attempt is a new one
          if (r.status === 'declined' || r.status === 'failed') message.error(`Payment declined: ${r.failureMessage ?? r.declineCode}`);
          else message.success(`Payment of ${usd(r.amountUsd)} accepted; waiting for the processor's confirmation`);
        },
        onError: (e) => message.error(e.message),
      },
    );

  return (
    <div data-testid="permit-payment">
      <Space wrap style={{ marginBottom: 8 }}>
        <span>Actual fee: <strong>{usd(p.actualFeeUsd)}</strong></span>
        <PaymentTag status={p.paymentStatus} />
      </Space>
      {latest && (latest.status === 'declined' || latest.status === 'failed') && !paid && (
        <Alert type="error" showIcon title="The card was declined" description={latest.failureMessage ?? latest.declineCode} style={{ marginBottom: 8 }} data-testid="payment-declined" />
      )}
      {p.status !== 'issued' && !paid && <Typography.Paragraph type="secondary">The fee is paid once the permit is issued.</Typography.Paragraph>}
      {canPay && (
        <div style={{ marginBottom: 8 }}>
          <Typography.Paragraph type="secondary" style={{ marginBottom: 4 }}>Test mode: choose a test card (no real card is charged).</Typography.Paragraph>
          <Radio.Group value={method} onChange={(e) => setMethod(e.target.value)} options={TEST_PAYMENT_METHODS.map((m) => ({ value: m.id, label: m.label }))} data-testid="test-card" />
          <div style={{ marginTop: 8 }}>
            <Button type="primary" onClick={submit} loading={pay.isPending} disabled={!p.actualFeeUsd} data-testid="permit-pay">
              Pay {usd(p.actualFeeUsd)}
            </Button>
            {!p.actualFeeUsd && <Typography.Text type="secondary" style={{ marginLeft: 8 }}>Record the actual fee first.</Typography.Text>}
          </div>
        </div>
      )}
      {canWork && p.status === 'void' && paid && p.refundable && (
        <Button
          onClick={() => refund.mutate({ permitId: p.id, reason: 'permit voided' }, { onSuccess: () => message.success('Fee refunded'), onError: (e) => message.error(e.message) })}
          loading={refund.isPending}
          data-testid="permit-refund"
        >
          Refund {usd(paid.amountUsd)}
        </Button>
      )}
      <Table
        size="small"
        rowKey="id"
        pagination={false}
        dataSource={p.payments}
        locale={{ emptyText: 'No payment yet' }}
        columns={[
          { title: 'Attempt', dataIndex: 'attempt', width: 70 },
          { title: 'Amount', dataIndex: 'amountUsd', render: (v: number) => usd(v) },
          { title: 'Status', dataIndex: 'status', render: (s: PaymentDto['status']) => <PaymentTag status={s} /> },
          { title: 'Card', dataIndex: 'paymentMethod' },
          { title: 'When', dataIndex: 'createdAt', render: (v: string) => new Date(v).toLocaleString() },
          { title: 'Processor id', dataIndex: 'stripePaymentIntentId', render: (v: string | null) => <Typography.Text code>{v ?? '—'}</Typography.Text> },
        ]}
      />
      <Typography.Paragraph type="secondary" style={{ marginTop: 8 }}>
        Validity: {localText(p.validFromLocal)} to {localText(p.validToLocal)} ({p.timeZone})
      </Typography.Paragraph>
    </div>
  );
}
