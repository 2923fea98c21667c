import { localInstant } from '../../../lib/time';
import { useMemo, useState } from 'react';
import { Alert, App, Button, Drawer, Form, Input, Modal, Select, Space, Table, Tag, Typography } from 'antd';
import {
  bookingWarnings, ESCORT_CERTIFICATION_NOTE, formatFeetInches, jurisdictionByCode,
  type EscortBookingDto, type EscortSlotDto, type MoveEscortsDto, type VendorDto,
} from '@amberline/common';
import { applyApiFieldErrors } from '../../../components/form-errors';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';
import { useCancelEscort } from '../api/cancel-escort';
import { useMoveEscorts } from '../api/get-move-escorts';
import { useVendors } from '../api/get-vendors';
import { useRequestEscort } from '../api/request-escort';
import { BookingStatusTag, CoverageTag } from './escort-tags';

const stateName = (c: string) => jurisdictionByCode(c)?.name ?? c;
const slotKey = (s: { position: string; seat: number }) => `${s.position}:${s.seat}`;

/** The escorts of one move, on the move page: positions the assessment requires, the bookings and their answers, and the request form. */
/** The move's escort positions and bookings; `origin` is where a new request's meeting point starts. */
export function MoveEscorts({ moveId, origin }: { moveId: string; origin: string }) {
  const { user } = useAuth();
  const canBook = accessFor(user?.role).canBookEscorts;
  const escorts = useMoveEscorts(moveId);
  const [requesting, setRequesting] = useState<string | null>(null);
  const [cancelling, setCancelling] = useState<EscortBookingDto | null>(null);

  if (escorts.isError) return <Alert type="error" showIcon title={escorts.error.message} />;
  if (!escorts.data) return <Typography.Text type="secondary">Loading escorts…</Typography.Text>;
  const d = escorts.data;
  const closed = ['running', 'delivered', 'cancelled'].includes(d.stage);
  const unconfirmed = d.slots.filter((s) => !s.satisfied);
  // a position can be asked for where no booking holds it (an answer awaited or dates proposed still hold it)
  const hasOpen = (s: EscortSlotDto) => s.jurisdictions.some((j) => j.status === 'open');
  const open = d.slots.filter(hasOpen);

  return (
    <div data-testid="move-escorts">
      <Alert type="warning" showIcon title={d.caution} style={{ marginBottom: 12 }} />
      {d.escortsNotOnFile.length > 0 && (
        <Alert
          type="warning"
          showIcon
          style={{ marginBottom: 12, borderStyle: 'dashed' }}
          data-testid="escorts-not-on-file"
          title={`Escorts not on file for ${d.escortsNotOnFile.join(', ')} — check the permit`}
          description="The rulebook has no escort rule on file for this load there; book what the issued permit asks."
        />
      )}
      {!d.needsEscorts && d.escortsNotOnFile.length > 0 ? null : !d.needsEscorts ? (
        <Alert
          type="info"
          showIcon
          data-testid="escorts-none-needed"
          title="The assessment asks for no escort on this route."
          description="The move can go to Escorts booked; the reason is written to its history."
        />
      ) : (
        <>
          <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 8 }} wrap>
            <Typography.Text strong>
              Required positions{' '}
              {unconfirmed.length === 0 ? <Tag color="success">all confirmed</Tag> : <Tag color="error">{unconfirmed.length} not confirmed</Tag>}
            </Typography.Text>
            {canBook && !closed && (
              <Button type="primary" disabled={!open.length} onClick={() => setRequesting(slotKey(open[0]))} data-testid="request-escort">
                Request an escort
              </Button>
            )}
          </Space>
          <Table<EscortSlotDto>
            size="small"
            rowKey={slotKey}
            pagination={false}
            dataSource={d.slots}
            data-testid="escort-slots"
            columns={[
              {
                title: 'Position',
                render: (_, s) => (
                  <span data-testid={`slot-${slotKey(s)}`}>
                    {s.label}
                    {s.heightPoleSetIn ? <Typography.Text type="secondary"> · pole at {formatFeetInches(s.heightPoleSetIn)}</Typography.Text> : null}
                  </span>
                ),
              },
              {
                title: 'Where',
                render: (_, s) => (
                  <Space size={[4, 4]} wrap>
                    {s.jurisdictions.map((j) => (
                      <CoverageTag key={j.code} code={j.code} status={j.status} vendor={j.vendor} />
                    ))}
                  </Space>
                ),
              },
              {
                title: 'Why',
                render: (_, s) => (
                  <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                    {[...new Set(s.jurisdictions.flatMap((j) => j.reasons))].join('; ')}
                  </Typography.Text>
                ),
              },
              ...(canBook && !closed
                ? [{ title: '', width: 90, render: (_: unknown, s: EscortSlotDto) => (hasOpen(s) ? <Button size="small" onClick={() => setRequesting(slotKey(s))}>Request</Button> : null) }]
                : []),
            ]}
          />
          {d.certificationStates.length > 0 && (
            <Typography.Paragraph type="secondary" style={{ marginTop: 8, fontSize: 12 }}>
              {d.certificationStates.map(stateName).join(', ')} ask escort operators for a certificate. {ESCORT_CERTIFICATION_NOTE}
            </Typography.Paragraph>
          )}
        </>
      )}

      {d.bookings.length > 0 && (
        <>
          <Typography.Text strong style={{ display: 'block', margin: '16px 0 8px' }}>
            Bookings
          </Typography.Text>
          <Table<EscortBookingDto>
            size="small"
            rowKey="id"
            pagination={false}
            dataSource={d.bookings}
            scroll={{ x: 900 }}
            data-testid="escort-bookings"
            onRow={() => ({ 'data-testid': 'escort-booking-row' }) as React.HTMLAttributes<HTMLElement>}
            columns={[
              { title: 'Vendor', render: (_, b) => <div><div>{b.vendor.company}</div><Typography.Text type="secondary" style={{ fontSize: 12 }}>{b.vendor.phone}</Typography.Text></div> },
              { title: 'Position', render: (_, b) => `${d.slots.find((s) => s.position === b.position && s.seat === b.seat)?.label ?? b.position} · ${b.jurisdictions.join(', ')}` },
              { title: 'Dates', render: (_, b) => (b.startDate === b.endDate ? b.startDate : `${b.startDate} – ${b.endDate}`) },
              { title: 'Status', render: (_, b) => <BookingStatusTag status={b.status} /> },
              { title: 'Answer', render: (_, b) => <AnswerText booking={b} /> },
              {
                title: '',
                width: 100,
                render: (_, b) =>
                  canBook && !closed && ['requested', 'proposed', 'confirmed'].includes(b.status) ? (
                    <Button size="small" danger onClick={() => setCancelling(b)}>
                      Call off
                    </Button>
                  ) : null,
              },
            ]}
          />
        </>
      )}
      {requesting && <RequestDrawer escorts={d} initialSlot={requesting} moveId={moveId} origin={origin} onClose={() => setRequesting(null)} />}
      <CancelModal moveId={moveId} booking={cancelling} onClose={() => setCancelling(null)} />
    </div>
  );
}

function AnswerText({ booking: b }: { booking: EscortBookingDto }) {
  const a = b.answer;
  const lines: React.ReactNode[] = [];
  if (b.status === 'requested') lines.push(<span key="w">Link sent {b.requestedAt.slice(0, 10)}{b.linkExpiresAt ? `, valid to ${localInstant(b.linkExpiresAt)}` : ''}{b.reminderSentAt ? '; reminder sent' : ''}</span>);
  if (a?.decision === 'confirm') {
    lines.push(<span key="c" data-testid="answer-operator">{a.operatorName} · {a.phone} · {a.vehicle}</span>);
    if (a.certifications?.length) lines.push(<span key="cc">Certificates: {a.certifications.map((c) => `${c.state} ${c.number}`).join(', ')}</span>);
  }
  if (a?.decision === 'decline') lines.push(<span key="d">Declined: {a.reason}</span>);
  if (a?.decision === 'propose') lines.push(<span key="p">Proposes {a.proposedStart} – {a.proposedEnd}{a.note ? `: ${a.note}` : ''}</span>);
  if (b.status === 'cancelled' && b.cancelReason) lines.push(<span key="x">Called off: {b.cancelReason}</span>);
  for (const [i, w] of b.warnings.entries()) lines.push(<Typography.Text key={`w${i}`} type="warning">⚠ {w}</Typography.Text>);
  return <div style={{ display: 'flex', flexDirection: 'column', fontSize: 12 }}>{lines}</div>;
}

type RequestValues = { slot: string; jurisdictions: string[]; vendorId: string; meetingPoint: string; meetingTime?: string; notes?: string };

function RequestDrawer({ escorts, initialSlot, moveId, origin, onClose }: { escorts: MoveEscortsDto; initialSlot: string; moveId: string; origin: string; onClose: () => void }) {
  const { message } = App.useApp();
  const [form] = Form.useForm<RequestValues>();
  const vendors = useVendors({});
  const request = useRequestEscort();
  const [unplaced, setUnplaced] = useState<string[]>([]);
  const slotValue = Form.useWatch('slot', form) ?? initialSlot;
  const chosen = Form.useWatch('jurisdictions', form);
  const vendorId = Form.useWatch('vendorId', form);
  const slot = escorts.slots.find((s) => slotKey(s) === slotValue);
  const openCodes = slot?.jurisdictions.filter((j) => j.status === 'open').map((j) => j.code) ?? [];
  const jurisdictions = chosen ?? openCodes;
  const fitting = useMemo(() => (vendors.data ?? []).filter((v) => jurisdictions.every((j) => v.states.includes(j))), [vendors.data, jurisdictions]);
  const vendor: VendorDto | undefined = vendors.data?.find((v) => v.id === vendorId);
  const lastDay = escorts.travelDates[escorts.travelDates.length - 1];
  const warnings = vendor && slot ? bookingWarnings(vendor, slot.position, jurisdictions, lastDay) : [];

  const submit = (v: RequestValues) => {
    const s = escorts.slots.find((x) => slotKey(x) === v.slot)!;
    setUnplaced([]);
    request.mutate(
      { moveId, position: s.position, seat: s.seat, jurisdictions: v.jurisdictions, vendorId: v.vendorId, meetingPoint: v.meetingPoint, ...(v.meetingTime ? { meetingTime: v.meetingTime } : {}), ...(v.notes ? { notes: v.notes } : {}) },
      {
        onSuccess: (b) => {
          message.success(`Request e-mailed to ${b.vendor.company}`);
          onClose();
        },
        onError: (e) => {
          const rest = applyApiFieldErrors(form, e, (f) => [f === 'position' || f === 'seat' ? 'slot' : f]);
          if (rest === null) message.error(e.message);
          else setUnplaced(rest);
        },
      },
    );
  };

  return (
    <Drawer title="Request an escort" open onClose={onClose} size={520} destroyOnHidden data-testid="request-escort-drawer">
      <Form<RequestValues>
        form={form}
        layout="vertical"
        onFinish={submit}
        initialValues={{ slot: initialSlot, jurisdictions: openCodes, meetingPoint: origin }}
        onValuesChange={(changed) => {
          if ('slot' in changed) {
            const s = escorts.slots.find((x) => slotKey(x) === changed.slot);
            form.setFieldsValue({ jurisdictions: s?.jurisdictions.filter((j) => j.status === 'open').map((j) => j.code) ?? [], vendorId: undefined });
          }
        }}
      >
        <Form.Item name="slot" label="Position" rules={[{ required: true }]}>
          <Select
            data-testid="request-slot"
            options={escorts.slots.filter((s) => s.jurisdictions.some((j) => j.status === 'open')).map((s) => ({ value: slotKey(s), label: `${s.label} (${s.jurisdictions.map((j) => j.code).join(', ')})` }))}
          />
        </Form.Item>
        <Form.Item name="jurisdictions" label="States of this request" rules={[{ required: true, message: 'Pick at least one state' }]}>
          <Select mode="multiple" options={(slot?.jurisdictions ?? []).map((j) => ({ value: j.code, label: `${j.name}${j.status !== 'open' ? ` (${j.status})` : ''}`, disabled: j.status !== 'open' }))} />
        </Form.Item>
        <Form.Item name="vendorId" label="Vendor" rules={[{ required: true, message: 'Pick a vendor' }]} extra={fitting.length ? `${fitting.length} vendor(s) cover ${jurisdictions.join(', ') || 'these states'}` : 'No vendor on file covers all these states'}>
          <Select
            data-testid="request-vendor"
            showSearch={{ optionFilterProp: 'label' }}
            loading={vendors.isPending}
            options={fitting.map((v) => ({ value: v.id, label: v.company }))}
            placeholder="Vendors covering the states"
          />
        </Form.Item>
        {warnings.length > 0 && (
          <Alert type="warning" showIcon style={{ marginBottom: 16 }} title="Check before sending" description={<ul style={{ margin: 0, paddingLeft: 18 }}>{warnings.map((w) => <li key={w}>{w}</li>)}</ul>} data-testid="request-warnings" />
        )}
        <Form.Item name="meetingPoint" label="Meeting point" rules={[{ required: true, message: 'Say where the escort meets the load' }, { max: 300 }]}>
          <Input placeholder="Yard, gate, truck stop…" />
        </Form.Item>
        <Form.Item name="meetingTime" label="Meeting time (local, 24-hour)" rules={[{ pattern: /^([01]\d|2[0-3]):[0-5]\d$/, message: 'HH:MM, e.g. 05:30' }]}>
          <Input placeholder="05:30" style={{ width: 120 }} />
        </Form.Item>
        <Form.Item name="notes" label="Notes for the vendor">
          <Input.TextArea rows={3} maxLength={2000} />
        </Form.Item>
        {unplaced.length > 0 && <Alert type="error" showIcon style={{ marginBottom: 12 }} title={unplaced.join('; ')} />}
        <Typography.Paragraph type="secondary" style={{ fontSize: 12 }}>
          Dates: {escorts.travelDates[0]}{escorts.travelDates.length > 1 ? ` – ${lastDay}` : ''}. The vendor gets an e-mail with the move summary and a link that works once, for 7 days or until departure.
        </Typography.Paragraph>
        <Button type="primary" htmlType="submit" loading={request.isPending} data-testid="send-escort-request">
          Send request
        </Button>
      </Form>
    </Drawer>
  );
}

function CancelModal({ moveId, booking, onClose }: { moveId: string; booking: EscortBookingDto | null; onClose: () => void }) {
  const { message } = App.useApp();
  const [reason, setReason] = useState('');
  const cancel = useCancelEscort();
  return (
    <Modal
      title={booking ? `Call off ${booking.vendor.company}?` : ''}
      open={!!booking}
      onCancel={onClose}
      okText="Call off"
      okButtonProps={{ danger: true, disabled: !reason.trim(), loading: cancel.isPending }}
      onOk={() =>
        booking &&
        cancel.mutate(
          { moveId, bookingId: booking.id, version: booking.version, reason: reason.trim() },
          {
            onSuccess: () => {
              message.success('Booking called off; the vendor is told by e-mail');
              setReason('');
              onClose();
            },
            onError: (e) => message.error(e.message),
          },
        )
      }
      destroyOnHidden
    >
      <Typography.Paragraph>The position opens again and the vendor&apos;s link stops working.</Typography.Paragraph>
      <Input.TextArea rows={2} placeholder="Reason (sent to the vendor)" value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} />
    </Modal>
  );
}
