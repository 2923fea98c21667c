import { Tag } from 'antd';
import {
  PAYMENT_STATUS_LABELS, PERMIT_STATUS_LABELS, PERMIT_URGENCY_LABELS,
  type PaymentStatus, type PermitStatus, type PermitUrgency,
} from '@amberline/common';

const STATUS_COLOR: Record<PermitStatus, string> = {
  to_file: 'default',
  filed: 'processing',
  issued: 'success',
  rejected: 'error',
  needs_amendment: 'warning',
  void: 'default',
};

export const PermitStatusTag = ({ status }: { status: PermitStatus }) => (
  <Tag color={STATUS_COLOR[status]} data-testid="permit-status">{PERMIT_STATUS_LABELS[status]}</Tag>
);

const URGENCY_COLOR: Record<PermitUrgency, string> = { overdue: 'error', due_soon: 'warning', upcoming: 'blue', settled: 'default' };

export function UrgencyTag({ urgency, daysToFileBy, fileBy }: { urgency: PermitUrgency; daysToFileBy: number; fileBy: string }) {
  const when = urgency === 'settled' ? '' : daysToFileBy < 0 ? ` · ${-daysToFileBy} d late` : daysToFileBy === 0 ? ' · today' : ` · ${daysToFileBy} d`;
  return (
    <Tag color={URGENCY_COLOR[urgency]} title={`file by ${fileBy}`}>
      {PERMIT_URGENCY_LABELS[urgency]}
      {when}
    </Tag>
  );
}

const PAYMENT_COLOR: Record<PaymentStatus, string> = {
  pending: 'default', processing: 'processing', succeeded: 'success', declined: 'error', failed: 'error', canceled: 'default', refunded: 'purple',
};

export const PaymentTag = ({ status }: { status: PaymentStatus | null }) =>
  status ? <Tag color={PAYMENT_COLOR[status]} data-testid="payment-status">{PAYMENT_STATUS_LABELS[status]}</Tag> : <Tag>Unpaid</Tag>;

export const usd = (v: number | null | undefined) => (v === null || v === undefined ? '—' : `$${v.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`);

/** `2026-12-10T00:00` (local to the permit's state) shown as `2026-12-10 00:00`. */
export const localText = (v: string | null) => (v ? v.replace('T', ' ') : '—');
