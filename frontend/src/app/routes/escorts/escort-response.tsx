import { localInstant } from '../../../lib/time';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { Alert, App, AutoComplete, Button, Card, Descriptions, Form, Input, Radio, Result, Space, Spin, Table, Typography } from 'antd';
import {
  ESCORT_CERTIFICATION_NOTE, formatFeetInches, formatPounds, jurisdictionByCode,
  type EscortAnswer, type EscortAnswerResult, type EscortDecision, type EscortRequestView,
} from '@amberline/common';
import { BrandMark } from '../../../components/brand-mark';
import { applyApiFieldErrors } from '../../../components/form-errors';
import { useAnswerEscortRequest } from '../../../features/escorts/api/answer-escort-request';
import { useEscortRequest } from '../../../features/escorts/api/get-escort-request';
import { ApiError } from '../../../lib/api-client';
import { palette } from '../../theme';

const stateName = (c: string) => jurisdictionByCode(c)?.name ?? c;

const LINK_PAGES: Record<string, { status: 'warning' | 'info' | 'error'; title: string }> = {
  invalid: { status: 'error', title: 'This link is not valid' },
  expired: { status: 'warning', title: 'This link has expired' },
  used: { status: 'info', title: 'This request has already been answered' },
  closed: { status: 'info', title: 'This request is no longer open' },
};

/** Why a link cannot be used, from the API's answer; null for other errors. */
function linkProblem(e: unknown): { status: 'warning' | 'info' | 'error'; title: string; text: string } | null {
  if (!(e instanceof ApiError)) return null;
  const link = (e.body.details as { link?: string } | undefined)?.link;
  return link && LINK_PAGES[link] ? { ...LINK_PAGES[link], text: e.message } : null;
}

function Frame({ children }: { children: React.ReactNode }) {
  return (
    <App>
    <div style={{ minHeight: '100vh', background: palette.slate50 }}>
      <div style={{ background: palette.slate900, color: '#fff', padding: '12px 16px', display: 'flex', alignItems: 'center', gap: 10 }}>
        <BrandMark size={28} />
        <span style={{ fontWeight: 600 }}>Amberline · escort request</span>
      </div>
      <div style={{ maxWidth: 860, margin: '0 auto', padding: 16 }}>{children}</div>
    </div>
    </App>
  );
}

/** The escort vendor's page, reached through the e-mailed link without an account: see the request, answer once. */
export function EscortResponsePage() {
  const { token = '' } = useParams();
  const request = useEscortRequest(token);
  const [done, setDone] = useState<EscortAnswerResult | null>(null);
  const [gone, setGone] = useState<ReturnType<typeof linkProblem>>(null);

  if (done) {
    return (
      <Frame>
        <Card>
          <Result status={done.status === 'confirmed' ? 'success' : 'info'} title={done.message} subTitle={done.warnings.length ? `Note: ${done.warnings.join('; ')}` : 'You can close this page.'} data-testid="answer-result" />
        </Card>
      </Frame>
    );
  }
  const problem = gone ?? (request.isError ? linkProblem(request.error) : null);
  if (problem) {
    return (
      <Frame>
        <Card>
          <Result status={problem.status} title={problem.title} subTitle={problem.text} data-testid="link-problem" />
        </Card>
      </Frame>
    );
  }
  if (request.isError) {
    return (
      <Frame>
        <Alert type="error" showIcon title="The request could not be loaded" description={request.error.message} />
      </Frame>
    );
  }
  if (!request.data) {
    return (
      <Frame>
        <div style={{ display: 'grid', placeItems: 'center', padding: 48 }}><Spin /></div>
      </Frame>
    );
  }
  return (
    <Frame>
      <RequestView r={request.data} />
      <AnswerForm r={request.data} token={token} onDone={setDone} onGone={setGone} />
    </Frame>
  );
}

function RequestView({ r }: { r: EscortRequestView }) {
  const d = r.move.dimensions;
  return (
    <Card style={{ marginBottom: 16 }} data-testid="escort-request">
      <Typography.Title level={3} style={{ marginTop: 0 }}>
        {r.vendor.company}: {r.positionLabel}
        {r.seat > 1 ? ` #${r.seat}` : ''} for move {r.move.reference}
      </Typography.Title>
      <Alert type="warning" showIcon title={r.caution} style={{ marginBottom: 12 }} />
      <Descriptions size="small" column={{ xs: 1, md: 2 }} bordered>
        <Descriptions.Item label="Dates">{r.startDate === r.endDate ? r.startDate : `${r.startDate} to ${r.endDate}`}</Descriptions.Item>
        <Descriptions.Item label="States">{r.jurisdictions.map(stateName).join(', ')}</Descriptions.Item>
        <Descriptions.Item label="Meeting point">
          {r.meetingPoint}
          {r.meetingTime ? ` at ${r.meetingTime} (local)` : ''}
        </Descriptions.Item>
        <Descriptions.Item label="Load">
          {r.move.commodity}, {r.move.origin} to {r.move.destination}
        </Descriptions.Item>
        <Descriptions.Item label="Dimensions">
          {formatFeetInches(d.widthIn)} wide · {formatFeetInches(d.heightIn)} high · {formatFeetInches(d.lengthIn)} long
          {d.frontOverhangIn > 0 ? ` · front overhang ${formatFeetInches(d.frontOverhangIn)}` : ''}
          {d.rearOverhangIn > 0 ? ` · rear overhang ${formatFeetInches(d.rearOverhangIn)}` : ''}
        </Descriptions.Item>
        <Descriptions.Item label="Gross weight">{formatPounds(d.grossLb)}</Descriptions.Item>
        {r.heightPoleSetIn !== null && <Descriptions.Item label="Height pole setting">{formatFeetInches(r.heightPoleSetIn)}</Descriptions.Item>}
        {r.requestedBy && (
          <Descriptions.Item label="Dispatcher">
            {r.requestedBy.name} · <a href={`mailto:${r.requestedBy.email}`}>{r.requestedBy.email}</a>
          </Descriptions.Item>
        )}
        {r.notes && <Descriptions.Item label="Notes">{r.notes}</Descriptions.Item>}
      </Descriptions>
      <Table
        size="small"
        style={{ marginTop: 12 }}
        rowKey="order"
        pagination={false}
        dataSource={r.move.route}
        columns={[
          { title: '#', dataIndex: 'order', width: 40 },
          { title: 'State', dataIndex: 'jurisdiction', width: 70 },
          { title: 'Roads', dataIndex: 'roads' },
          { title: 'Miles', dataIndex: 'miles', width: 70 },
          { title: 'Road type', dataIndex: 'roadType', width: 110 },
        ]}
      />
      <Typography.Paragraph type="secondary" style={{ marginTop: 8, fontSize: 12 }}>
        This link works once, until {localInstant(r.linkExpiresAt)}.
        {r.certificationStates.length > 0 && ` ${r.certificationStates.map(stateName).join(', ')} ask escort operators for a certificate. ${ESCORT_CERTIFICATION_NOTE}`}
      </Typography.Paragraph>
    </Card>
  );
}

type AnswerValues = {
  decision: EscortDecision;
  operatorName?: string;
  vehicle?: string;
  phone?: string;
  certs?: Record<string, string | undefined>;
  reason?: string;
  proposedStart?: string;
  proposedEnd?: string;
  note?: string;
};

/** The certificate numbers typed per state, one entry a state with a number (blank fields left out). */
function certificationsOf(certs: Record<string, string | undefined> | undefined): { state: string; number: string }[] {
  return Object.entries(certs ?? {})
    .filter(([, n]) => typeof n === 'string' && n.trim() !== '')
    .map(([state, n]) => ({ state, number: n!.trim() }));
}

function AnswerForm({ r, token, onDone, onGone }: { r: EscortRequestView; token: string; onDone: (a: EscortAnswerResult) => void; onGone: (p: ReturnType<typeof linkProblem>) => void }) {
  const { message } = App.useApp();
  const [form] = Form.useForm<AnswerValues>();
  const answer = useAnswerEscortRequest();
  const decision = Form.useWatch('decision', form) ?? 'confirm';
  const [unplaced, setUnplaced] = useState<string[]>([]);

  const pickOperator = (name: string) => {
    const op = r.vendor.operators.find((o) => o.name === name);
    if (!op) return;
    const certs: Record<string, string> = {};
    for (const c of op.certifications) if (r.jurisdictions.includes(c.state)) certs[c.state] = c.number;
    form.setFieldsValue({ phone: form.getFieldValue('phone') || op.phone || undefined, certs: { ...form.getFieldValue('certs'), ...certs } });
  };

  const submit = (v: AnswerValues) => {
    setUnplaced([]);
    const body: EscortAnswer =
      v.decision === 'confirm'
        ? {
            decision: 'confirm',
            operatorName: v.operatorName,
            vehicle: v.vehicle,
            phone: v.phone,
            certifications: certificationsOf(v.certs),
            ...(v.note ? { note: v.note } : {}),
          }
        : v.decision === 'decline'
          ? { decision: 'decline', reason: v.reason }
          : { decision: 'propose', proposedStart: v.proposedStart, proposedEnd: v.proposedEnd, ...(v.note ? { note: v.note } : {}) };
    answer.mutate(
      { token, ...body },
      {
        onSuccess: onDone,
        onError: (e) => {
          const p = linkProblem(e);
          if (p) return onGone(p);
          const sent = body.decision === 'confirm' ? (body.certifications ?? []) : [];
          const rest = applyApiFieldErrors(form, e, (f) => {
            const at = /^certifications\.(\d+)/.exec(f);
            return at && sent[Number(at[1])] ? ['certs', sent[Number(at[1])].state] : [f];
          });
          if (rest === null) message.error(e.message);
          else setUnplaced(rest);
        },
      },
    );
  };

  return (
    <Card title="Your answer" data-testid="answer-form">
      <Form<AnswerValues> form={form} layout="vertical" initialValues={{ decision: 'confirm' }} onFinish={submit}>
        <Form.Item name="decision">
          <Radio.Group
            optionType="button"
            buttonStyle="solid"
            options={[
              { value: 'confirm', label: 'Confirm these dates' },
              { value: 'decline', label: 'Decline' },
              { value: 'propose', label: 'Propose other dates' },
            ]}
          />
        </Form.Item>
        {decision === 'confirm' && (
          <>
            <Form.Item name="operatorName" label="Operator" rules={[{ required: true, message: 'Name the operator who will drive the escort vehicle' }]}>
              <AutoComplete options={r.vendor.operators.map((o) => ({ value: o.name }))} onSelect={pickOperator} placeholder="Operator's name" />
            </Form.Item>
            <Form.Item name="vehicle" label="Vehicle" rules={[{ required: true, message: 'Name the escort vehicle' }]}>
              <AutoComplete options={r.vendor.vehicles.map((v) => ({ value: v.plate ? `${v.label}, ${v.plate}` : v.label }))} placeholder="Make, color, plate" />
            </Form.Item>
            <Form.Item name="phone" label="Phone on the road" rules={[{ required: true, message: 'Give a phone number' }, { pattern: /^[0-9+()\-. ]{7,40}$/, message: '7–40 digits, spaces, + ( ) - .' }]}>
              <Input inputMode="tel" />
            </Form.Item>
            {/* no name here: a named item would take the inputs' bubbled change events as its own value */}
            <Form.Item label="Certificate numbers" extra={r.certificationStates.length ? `Asked for in ${r.certificationStates.map(stateName).join(', ')} (sample data).` : 'None of these states is on our list of states that ask for one.'}>
              <div style={{ display: 'grid', gap: 8 }}>
                {r.jurisdictions.map((c) => (
                  <Space.Compact key={c} style={{ width: '100%' }}>
                    <Space.Addon style={{ width: 48 }}>{c}</Space.Addon>
                    <Form.Item name={['certs', c]} noStyle>
                      <Input placeholder={r.certificationStates.includes(c) ? `${stateName(c)} certificate number` : 'optional'} aria-label={`${c} certificate number`} />
                    </Form.Item>
                  </Space.Compact>
                ))}
              </div>
            </Form.Item>
          </>
        )}
        {decision === 'decline' && (
          <Form.Item name="reason" label="Reason" rules={[{ required: true, message: 'Say why, so the dispatcher can plan' }]}>
            <Input.TextArea rows={3} maxLength={1000} />
          </Form.Item>
        )}
        {decision === 'propose' && (
          <div style={{ display: 'flex', gap: 12, flexWrap: 'wrap' }}>
            <Form.Item name="proposedStart" label="First day" rules={[{ required: true, message: 'Pick a day' }]}>
              <Input type="date" />
            </Form.Item>
            <Form.Item name="proposedEnd" label="Last day" rules={[{ required: true, message: 'Pick a day' }]}>
              <Input type="date" />
            </Form.Item>
          </div>
        )}
        {decision !== 'decline' && (
          <Form.Item name="note" label="Note for the dispatcher">
            <Input.TextArea rows={2} maxLength={1000} />
          </Form.Item>
        )}
        {unplaced.length > 0 && <Alert type="error" showIcon style={{ marginBottom: 12 }} title={unplaced.join('; ')} />}
        <Button type="primary" htmlType="submit" loading={answer.isPending} data-testid="send-answer">
          {decision === 'confirm' ? 'Confirm' : decision === 'decline' ? 'Decline' : 'Send proposal'}
        </Button>
        <Typography.Paragraph type="secondary" style={{ marginTop: 8, fontSize: 12 }}>
          One answer per link. To change it afterwards, call the dispatcher.
        </Typography.Paragraph>
      </Form>
    </Card>
  );
}
