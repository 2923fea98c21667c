import { useEffect, useState } from 'react';
import {
  Alert, App, Button, Col, Descriptions, Divider, Drawer, Form, Input, InputNumber, Modal, Row, Select, Space, Spin, Switch, Timeline, Typography,
} from 'antd';
import { Link } from 'react-router-dom';
import {
  formatFeetInches, formatPounds, PERMIT_STATUS_LABELS, PERMIT_TRANSITIONS, PERMIT_TYPE_LABELS, PERMIT_TYPES,
  type PermitDto, type PermitStatus, type PermitType, type UpdatePermitRequest,
} from '@amberline/common';
import { Caution } from '../../../components/caution';
import { to } from '../../../config/paths';
import { ApiError } from '../../../lib/api-client';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';
import { useAssignees } from '../api/get-assignees';
import { usePermit } from '../api/get-permit';
import { useUpdatePermit } from '../api/update-permit';
import { PermitStatusTag, usd } from './permit-tags';
import { NotOnFile } from '../../../components/rule-source';
import { PermitDocuments } from './permit-documents';
import { PermitPayment } from './permit-payment';
import { fieldsToTravel, PermitTravelFields, travelToFields, type TravelFieldValues } from './permit-travel-fields';

type FormValues = TravelFieldValues & {
  permitType: PermitType;
  permitNumber?: string;
  validFrom?: string;
  validTo?: string;
  routeText?: string;
  conditionsText?: string;
  actualFeeUsd?: number | null;
  assigneeId?: string | null;
  notes?: string;
  escortsFront?: number;
  escortsRear?: number;
  heightPole?: boolean;
  travelHours?: string;
  holidays?: string;
  maxSpeedMph?: number;
  utilityContacts?: string[];
};

const ACTION_LABELS: Partial<Record<PermitStatus, string>> = {
  filed: 'Record filing',
  issued: 'Record issue',
  rejected: 'Record rejection',
  to_file: 'Back to “to file”',
  needs_amendment: 'Flag for amendment',
  void: 'Void',
};
const NEEDS_REASON: PermitStatus[] = ['rejected', 'void', 'needs_amendment'];

function toForm(p: PermitDto): FormValues {
  return {
    permitType: p.permitType,
    permitNumber: p.permitNumber ?? undefined,
    validFrom: p.validFromLocal ?? undefined,
    validTo: p.validToLocal ?? undefined,
    routeText: p.routeText ?? undefined,
    conditionsText: p.conditionsText ?? undefined,
    actualFeeUsd: p.actualFeeUsd,
    assigneeId: p.assignee?.id ?? null,
    notes: p.notes ?? undefined,
    ...p.conditions,
    ...travelToFields(p.conditions.travel),
  };
}

function toRequest(v: FormValues, version: number, before: PermitDto): UpdatePermitRequest {
  const travel = fieldsToTravel(v, before.conditions.travel);
  const conditions = {
    ...(travel ? { travel } : {}),
    ...(v.escortsFront !== undefined && v.escortsFront !== null ? { escortsFront: v.escortsFront } : {}),
    ...(v.escortsRear !== undefined && v.escortsRear !== null ? { escortsRear: v.escortsRear } : {}),
    ...(v.heightPole !== undefined ? { heightPole: v.heightPole } : {}),
    ...(v.travelHours ? { travelHours: v.travelHours } : {}),
    ...(v.holidays ? { holidays: v.holidays } : {}),
    ...(v.maxSpeedMph ? { maxSpeedMph: v.maxSpeedMph } : {}),
    ...(v.utilityContacts?.length ? { utilityContacts: v.utilityContacts } : {}),
  };
  return {
    version,
    permitType: v.permitType,
    permitNumber: v.permitNumber?.trim() || null,
    validFrom: v.validFrom || null,
    validTo: v.validTo || null,
    routeText: v.routeText?.trim() || null,
    conditionsText: v.conditionsText?.trim() || null,
    actualFeeUsd: v.actualFeeUsd ?? null,
    assigneeId: v.assigneeId ?? null,
    notes: v.notes?.trim() || null,
    conditions,
  };
}

/** The permit form: filing, issue (number, validity, conditions, fee), PDFs with upload progress, the fee payment. */
export function PermitDrawer({ permitId, onClose }: { permitId: string | null; onClose: () => void }) {
  const { user } = useAuth();
  const canWork = accessFor(user?.role).canWorkPermits;
  const permit = usePermit(permitId ?? undefined);
  const p = permit.data;
  return (
    <Drawer
      open={!!permitId}
      onClose={onClose}
      size={720}
      destroyOnHidden
      title={p ? <Space data-testid="permit-drawer-title">{`${p.jurisdictionName} permit`}<PermitStatusTag status={p.status} /></Space> : 'Permit'}
    >
      {permit.isPending && <Spin />}
      {permit.isError && <Alert type="error" showIcon title={permit.error.message} />}
      {p && <PermitDetails p={p} canWork={canWork} />}
    </Drawer>
  );
}

function PermitDetails({ p, canWork }: { p: PermitDto; canWork: boolean }) {
  const { message } = App.useApp();
  const [form] = Form.useForm<FormValues>();
  const update = useUpdatePermit();
  const assignees = useAssignees(canWork);
  const [reasonFor, setReasonFor] = useState<PermitStatus | null>(null);
  const [reason, setReason] = useState('');
  const locked = !canWork || p.status === 'void';

  useEffect(() => {
    form.setFieldsValue(toForm(p));
  }, [p, form]);

  const save = async (status?: PermitStatus, why?: string) => {
    let values: FormValues;
    try {
      values = await form.validateFields();
    } catch {
      return;
    }
    const body = { ...toRequest(values, p.version, p), ...(status ? { status } : {}), ...(why ? { reason: why } : {}) };
    update.mutate(
      { id: p.id, ...body },
      {
        onSuccess: (r) => {
          message.success(status ? `${r.jurisdiction} permit: ${PERMIT_STATUS_LABELS[r.status].toLowerCase()}` : 'Permit saved');
          setReasonFor(null);
          setReason('');
        },
        onError: (e) => {
          if (e instanceof ApiError && e.fieldErrors().length) {
            const known = new Set(Object.keys(toForm(p)).concat(['escortsFront', 'maxSpeedMph', 'utilityContacts', 'hoursStart', 'hoursEnd', 'hoursStartOffsetMin', 'hoursEndOffsetMin', 'holidayNames', 'weekendBanDays']));
            const TRAVEL_FIELDS: Record<string, string> = { 'travel.hours.start': 'hoursStart', 'travel.hours.end': 'hoursEnd', 'travel.hours.startOffsetMin': 'hoursStartOffsetMin', 'travel.hours.endOffsetMin': 'hoursEndOffsetMin', 'travel.holidays.names': 'holidayNames' };
            const fe = e.fieldErrors().map((f) => {
              const name = f.name.replace(/^conditions\./, '');
              return { ...f, name: TRAVEL_FIELDS[name] ?? (name.startsWith('travel.weekendBans') ? 'weekendBanDays' : name) };
            });
            form.setFields(fe.filter((f) => known.has(f.name)) as Parameters<typeof form.setFields>[0]);
            if (fe.some((f) => !known.has(f.name))) message.error(e.message);
          } else message.error(e.message);
        },
      },
    );
  };

  const next = PERMIT_TRANSITIONS[p.status];

  return (
    <div data-testid="permit-details">
      <Descriptions size="small" column={2} style={{ marginBottom: 12 }}>
        <Descriptions.Item label="Move"><Link to={to.move(p.moveId)}>{p.moveReference}</Link> · {p.customer}</Descriptions.Item>
        <Descriptions.Item label="Departs">{p.departure}</Descriptions.Item>
        <Descriptions.Item label="File by">
          {p.fileBy} {p.leadTimeDays !== null ? `(${p.leadTimeDays} d lead time)` : <NotOnFile>lead time not on file — no later than the departure</NotOnFile>}
        </Descriptions.Item>
        <Descriptions.Item label="Times in">{p.timeZone}</Descriptions.Item>
        <Descriptions.Item label="Estimated fee">
          {p.estimatedFeeUsd !== null ? usd(p.estimatedFeeUsd) : <NotOnFile>unknown — fee not on file</NotOnFile>} (rulebook{p.ruleVersion ? ` v${p.ruleVersion}` : ''})
        </Descriptions.Item>
        {p.conditions.escortsKnown === false && (
          <Descriptions.Item label="Escorts (rulebook)">
            <NotOnFile>escorts not on file for {p.jurisdiction} — take them from the permit</NotOnFile>
          </Descriptions.Item>
        )}
        <Descriptions.Item label="Refundable">{p.refundable === null ? 'rule does not say' : p.refundable ? 'yes' : 'no'}</Descriptions.Item>
        {p.filedAt && <Descriptions.Item label="Filed">{new Date(p.filedAt).toLocaleString()}</Descriptions.Item>}
        {p.issuedAt && <Descriptions.Item label="Issued">{new Date(p.issuedAt).toLocaleString()}</Descriptions.Item>}
      </Descriptions>
      {p.amendmentReason && <Alert type="warning" showIcon title="Needs amendment" description={p.amendmentReason} style={{ marginBottom: 12 }} data-testid="amendment-reason" />}
      {p.expiryWarning && <Alert type="error" showIcon title={`Validity: ${p.expiryWarning}`} style={{ marginBottom: 12 }} />}
      {!p.needed && <Alert type="info" showIcon title="The current plan does not need this permit." style={{ marginBottom: 12 }} />}
      <Caution kind="rulebook" />

      {canWork && p.status !== 'void' && (
        <Space wrap style={{ marginBottom: 12 }} data-testid="permit-actions">
          {next.map((s) => (
            <Button
              key={s}
              type={s === 'filed' || s === 'issued' ? 'primary' : 'default'}
              danger={s === 'void' || s === 'rejected'}
              loading={update.isPending && update.variables?.status === s}
              onClick={() => (NEEDS_REASON.includes(s) ? setReasonFor(s) : save(s))}
              data-testid={`permit-to-${s}`}
            >
              {ACTION_LABELS[s] ?? PERMIT_STATUS_LABELS[s]}
            </Button>
          ))}
        </Space>
      )}

      <Form form={form} layout="vertical" disabled={locked} initialValues={toForm(p)} onFinish={() => save()}>
        <Row gutter={12}>
          <Col span={8}>
            <Form.Item name="permitType" label="Permit type">
              <Select options={PERMIT_TYPES.map((t) => ({ value: t, label: PERMIT_TYPE_LABELS[t] }))} />
            </Form.Item>
          </Col>
          <Col span={8}>
            <Form.Item name="permitNumber" label="Permit number" rules={[{ max: 60 }]}>
              <Input placeholder="as printed on the permit" />
            </Form.Item>
          </Col>
          <Col span={8}>
            <Form.Item name="actualFeeUsd" label="Actual fee (USD)">
              <InputNumber min={0.5} max={100000} precision={2} prefix="$" style={{ width: '100%' }} />
            </Form.Item>
          </Col>
        </Row>
        <Row gutter={12}>
          <Col span={12}>
            <Form.Item name="validFrom" label={`Valid from (${p.timeZone})`}>
              <Input type="datetime-local" aria-label="Valid from" />
            </Form.Item>
          </Col>
          <Col span={12}>
            <Form.Item name="validTo" label={`Valid to (${p.timeZone})`}>
              <Input type="datetime-local" aria-label="Valid to" />
            </Form.Item>
          </Col>
        </Row>
        <Form.Item name="routeText" label="Route as permitted"><Input.TextArea rows={2} maxLength={2000} /></Form.Item>
        <Typography.Text strong>Conditions</Typography.Text>
        <Row gutter={12} style={{ marginTop: 8 }}>
          <Col span={6}><Form.Item name="escortsFront" label="Escorts front"><InputNumber min={0} max={6} style={{ width: '100%' }} /></Form.Item></Col>
          <Col span={6}><Form.Item name="escortsRear" label="Escorts rear"><InputNumber min={0} max={6} style={{ width: '100%' }} /></Form.Item></Col>
          <Col span={6}><Form.Item name="heightPole" label="Height pole" valuePropName="checked"><Switch /></Form.Item></Col>
          <Col span={6}><Form.Item name="maxSpeedMph" label="Max speed (mph)"><InputNumber min={5} max={80} style={{ width: '100%' }} /></Form.Item></Col>
        </Row>
        <PermitTravelFields />
        <Row gutter={12}>
          <Col span={12}><Form.Item name="travelHours" label="Travel hours (as worded)"><Input maxLength={200} placeholder="e.g. 30 min before sunrise to 30 min after sunset" /></Form.Item></Col>
          <Col span={12}><Form.Item name="holidays" label="Holidays"><Input maxLength={200} placeholder="e.g. no travel from noon the weekday before" /></Form.Item></Col>
        </Row>
        <Form.Item name="utilityContacts" label="Utility contacts"><Select mode="tags" tokenSeparators={[';']} placeholder="name and phone; press Enter after each" /></Form.Item>
        <Form.Item name="conditionsText" label="Other conditions"><Input.TextArea rows={2} maxLength={4000} /></Form.Item>
        <Row gutter={12}>
          <Col span={12}>
            <Form.Item name="assigneeId" label="Assignee">
              <Select allowClear showSearch optionFilterProp="label" loading={assignees.isPending} options={(assignees.data ?? []).map((a) => ({ value: a.id, label: a.name }))} />
            </Form.Item>
          </Col>
          <Col span={12}><Form.Item name="notes" label="Notes"><Input.TextArea rows={1} maxLength={4000} /></Form.Item></Col>
        </Row>
        {!locked && <Button htmlType="submit" loading={update.isPending && !update.variables?.status} data-testid="permit-save">Save</Button>}
      </Form>

      {p.permitted && (
        <>
          <Divider titlePlacement="start">As permitted (plan revision {p.permitted.planRevision})</Divider>
          <Descriptions size="small" column={3}>
            <Descriptions.Item label="Width">{formatFeetInches(p.permitted.widthIn)}</Descriptions.Item>
            <Descriptions.Item label="Height">{formatFeetInches(p.permitted.heightIn)}</Descriptions.Item>
            <Descriptions.Item label="Length">{formatFeetInches(p.permitted.lengthIn)}</Descriptions.Item>
            <Descriptions.Item label="Gross">{formatPounds(p.permitted.grossLb)}</Descriptions.Item>
            <Descriptions.Item label="Trailer axles">{formatPounds(p.permitted.trailerLb)}</Descriptions.Item>
            <Descriptions.Item label="Miles here">{p.permitted.miles}</Descriptions.Item>
          </Descriptions>
        </>
      )}

      <Divider titlePlacement="start">Permit PDF</Divider>
      <PermitDocuments p={p} canWork={canWork && p.status !== 'void'} />

      <Divider titlePlacement="start">Fee</Divider>
      <PermitPayment p={p} canWork={canWork} />

      <Divider titlePlacement="start">History</Divider>
      <Timeline
        items={p.history.map((h) => ({
          key: h.version,
          content: (
            <span>
              <strong>v{h.version}</strong> {PERMIT_STATUS_LABELS[h.status]} · {new Date(h.createdAt).toLocaleString()} {h.createdBy ? `· ${h.createdBy.name}` : '· system'}
              {h.reason ? <div><Typography.Text type="secondary">{h.reason}</Typography.Text></div> : null}
            </span>
          ),
        }))}
      />

      <Modal
        open={!!reasonFor}
        title={reasonFor ? `${ACTION_LABELS[reasonFor]}: why?` : ''}
        okText={reasonFor ? ACTION_LABELS[reasonFor] : 'OK'}
        okButtonProps={{ disabled: !reason.trim(), danger: reasonFor === 'void' || reasonFor === 'rejected', loading: update.isPending }}
        onOk={() => reasonFor && save(reasonFor, reason.trim())}
        onCancel={() => setReasonFor(null)}
        destroyOnHidden
      >
        <Input.TextArea rows={3} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} aria-label="Reason" />
      </Modal>
    </div>
  );
}
