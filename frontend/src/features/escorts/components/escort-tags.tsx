import { Tag } from 'antd';
import { BOOKING_STATUS_LABELS, type BookingStatus, type SlotCoverageStatus } from '@amberline/common';

const BOOKING_COLORS: Record<BookingStatus, string> = { requested: 'processing', confirmed: 'success', declined: 'error', proposed: 'warning', cancelled: 'default' };

export function BookingStatusTag({ status }: { status: BookingStatus }) {
  return (
    <Tag color={BOOKING_COLORS[status]} data-testid={`booking-status-${status}`}>
      {BOOKING_STATUS_LABELS[status]}
    </Tag>
  );
}

const COVER: Record<SlotCoverageStatus, { color: string; label: string }> = {
  confirmed: { color: 'success', label: 'Confirmed' },
  requested: { color: 'processing', label: 'Awaiting answer' },
  proposed: { color: 'warning', label: 'Other dates proposed' },
  open: { color: 'error', label: 'Open' },
};

export function CoverageTag({ code, status, vendor }: { code: string; status: SlotCoverageStatus; vendor: string | null }) {
  return (
    <Tag color={COVER[status].color} data-testid={`coverage-${code}-${status}`}>
      {code}: {COVER[status].label}
      {vendor && status !== 'open' ? ` · ${vendor}` : ''}
    </Tag>
  );
}

export const usd = (n: number | undefined) => (n === undefined ? null : `$${n.toLocaleString('en-US', { minimumFractionDigits: n % 1 ? 2 : 0, maximumFractionDigits: 2 })}`);
