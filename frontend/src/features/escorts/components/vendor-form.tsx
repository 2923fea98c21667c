import { useState } from 'react';
import { Alert, App, Button, Card, Checkbox, Col, Divider, Form, Input, InputNumber, Radio, Row, Select, Space, Switch, Typography } from 'antd';
import { EQUIPMENT_LABELS, JURISDICTIONS, type EscortEquipment, type VendorDto, type VendorInput } from '@amberline/common';
import { applyApiFieldErrors } from '../../../components/form-errors';
import { useCreateVendor } from '../api/create-vendor';
import { useUpdateVendor } from '../api/update-vendor';

const stateOptions = JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} · ${j.name}` }));
const EQUIPMENT = Object.keys(EQUIPMENT_LABELS) as (keyof EscortEquipment)[];
const DATE_RULE = { pattern: /^\d{4}-\d{2}-\d{2}$/, message: 'a date, YYYY-MM-DD' };

const blank = (): VendorInput => ({
  company: '',
  contactName: '',
  email: '',
  phone: '',
  states: [],
  operators: [{ name: '', certifications: [] }],
  insurance: { liabilityLimitUsd: 1_000_000, expires: '' },
  vehicles: [{ label: '', equipment: { heightPole: false, amberLights: true, signs: true, flags: true } }],
  rates: { basis: 'per_mile' },
  active: true,
});

/** Drops empty optional strings and unset numbers, so the server sees only what was filled in. */
function clean<T>(v: T): T {
  if (Array.isArray(v)) return v.map(clean) as T;
  if (v && typeof v === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v)) {
      if (x === undefined || x === null || (typeof x === 'string' && x.trim() === '')) continue;
      out[k] = clean(x);
    }
    return out as T;
  }
  return typeof v === 'string' ? (v.trim() as T) : v;
}

/** Create or edit an escort vendor: contact, coverage, operators and certificates, insurance, vehicles, rates. */
export function VendorForm({ vendor, onDone }: { vendor: VendorDto | null; onDone: () => void }) {
  const { message } = App.useApp();
  const [form] = Form.useForm<VendorInput>();
  const create = useCreateVendor();
  const update = useUpdateVendor();
  const [unplaced, setUnplaced] = useState<string[]>([]);
  const basis = Form.useWatch(['rates', 'basis'], form);

  const submit = (values: VendorInput) => {
    setUnplaced([]);
    const body = clean({ ...values, operators: values.operators ?? [], vehicles: values.vehicles ?? [] });
    body.operators = body.operators.map((o) => ({ ...o, certifications: o.certifications ?? [] }));
    const handlers = {
      onSuccess: (v: VendorDto) => {
        message.success(`${v.company} saved`);
        onDone();
      },
      onError: (e: Error) => {
        const rest = applyApiFieldErrors(form, e);
        if (rest === null) message.error(e.message);
        else setUnplaced(rest);
      },
    };
    if (vendor) update.mutate({ ...body, id: vendor.id, version: vendor.version }, handlers);
    else create.mutate(body, handlers);
  };

  const initial: VendorInput = vendor
    ? { company: vendor.company, contactName: vendor.contactName, email: vendor.email, phone: vendor.phone, states: vendor.states, operators: vendor.operators, insurance: vendor.insurance, vehicles: vendor.vehicles, rates: vendor.rates, notes: vendor.notes ?? undefined, active: vendor.active }
    : blank();

  return (
    <Form<VendorInput> form={form} layout="vertical" initialValues={initial} onFinish={submit} data-testid="vendor-form">
      <Row gutter={12}>
        <Col xs={24} md={12}>
          <Form.Item name="company" label="Company" rules={[{ required: true }, { max: 120 }]}><Input /></Form.Item>
        </Col>
        <Col xs={24} md={12}>
          <Form.Item name="contactName" label="Contact" rules={[{ required: true }, { max: 120 }]}><Input /></Form.Item>
        </Col>
        <Col xs={24} md={12}>
          <Form.Item name="email" label="E-mail (requests go here)" rules={[{ required: true }, { type: 'email' }]}><Input /></Form.Item>
        </Col>
        <Col xs={24} md={12}>
          <Form.Item name="phone" label="Phone" rules={[{ required: true }, { pattern: /^[0-9+()\-. ]{7,40}$/, message: '7–40 digits, spaces, + ( ) - .' }]}><Input /></Form.Item>
        </Col>
      </Row>
      <Form.Item name="states" label="States covered" rules={[{ required: true, message: 'Pick at least one state' }]}>
        <Select mode="multiple" options={stateOptions} showSearch={{ optionFilterProp: 'label' }} data-testid="vendor-states" />
      </Form.Item>

      <Divider titlePlacement="start">Operators and certificates</Divider>
      <Form.List name="operators">
        {(ops, { add, remove }) => (
          <>
            {ops.map((op) => (
              <Card key={op.key} size="small" style={{ marginBottom: 8 }} extra={<Button size="small" type="link" danger onClick={() => remove(op.name)}>Remove</Button>} title={`Operator ${op.name + 1}`}>
                <Row gutter={8}>
                  <Col xs={24} md={12}><Form.Item name={[op.name, 'name']} label="Name" rules={[{ required: true }]}><Input /></Form.Item></Col>
                  <Col xs={24} md={12}><Form.Item name={[op.name, 'phone']} label="Phone"><Input /></Form.Item></Col>
                </Row>
                <Form.List name={[op.name, 'certifications']}>
                  {(certs, c) => (
                    <>
                      {certs.map((cert) => (
                        <Space key={cert.key} align="start" wrap>
                          <Form.Item name={[cert.name, 'state']} rules={[{ required: true, message: 'state' }]}><Select options={stateOptions} style={{ width: 150 }} placeholder="State" showSearch={{ optionFilterProp: 'label' }} /></Form.Item>
                          <Form.Item name={[cert.name, 'number']} rules={[{ required: true, message: 'number' }]}><Input placeholder="Certificate number" /></Form.Item>
                          <Form.Item name={[cert.name, 'expires']} rules={[{ required: true, message: 'expiry' }, DATE_RULE]}><Input type="date" aria-label="Certificate expires" /></Form.Item>
                          <Button type="link" danger onClick={() => c.remove(cert.name)}>×</Button>
                        </Space>
                      ))}
                      <Button size="small" onClick={() => c.add({ state: undefined, number: '', expires: '' })}>Add certificate</Button>
                    </>
                  )}
                </Form.List>
              </Card>
            ))}
            <Button onClick={() => add({ name: '', certifications: [] })}>Add operator</Button>
          </>
        )}
      </Form.List>

      <Divider titlePlacement="start">Insurance</Divider>
      <Row gutter={12}>
        <Col xs={24} md={12}><Form.Item name={['insurance', 'carrier']} label="Insurer"><Input /></Form.Item></Col>
        <Col xs={24} md={12}><Form.Item name={['insurance', 'policyNumber']} label="Policy number"><Input /></Form.Item></Col>
        <Col xs={24} md={8}><Form.Item name={['insurance', 'liabilityLimitUsd']} label="Liability limit (USD)" rules={[{ required: true }]}><InputNumber min={0} step={100000} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={24} md={8}><Form.Item name={['insurance', 'autoLimitUsd']} label="Auto limit (USD)"><InputNumber min={0} step={100000} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={24} md={8}><Form.Item name={['insurance', 'expires']} label="Expires" rules={[{ required: true }, DATE_RULE]}><Input type="date" /></Form.Item></Col>
      </Row>

      <Divider titlePlacement="start">Vehicles and equipment</Divider>
      <Form.List name="vehicles">
        {(vs, { add, remove }) => (
          <>
            {vs.map((v) => (
              <Card key={v.key} size="small" style={{ marginBottom: 8 }}>
                <Space align="start" wrap>
                  <Form.Item name={[v.name, 'label']} rules={[{ required: true, message: 'name the vehicle' }]}><Input placeholder="Vehicle, e.g. white pickup" /></Form.Item>
                  <Form.Item name={[v.name, 'plate']}><Input placeholder="Plate" style={{ width: 120 }} /></Form.Item>
                  <Button type="link" danger onClick={() => remove(v.name)}>Remove</Button>
                </Space>
                <Space wrap>
                  {EQUIPMENT.map((k) => (
                    <Form.Item key={k} name={[v.name, 'equipment', k]} valuePropName="checked" initialValue={false} style={{ marginBottom: 0 }}>
                      <Checkbox>{EQUIPMENT_LABELS[k]}</Checkbox>
                    </Form.Item>
                  ))}
                </Space>
              </Card>
            ))}
            <Button onClick={() => add({ label: '', equipment: { heightPole: false, amberLights: true, signs: true, flags: true } })}>Add vehicle</Button>
          </>
        )}
      </Form.List>

      <Divider titlePlacement="start">Rates</Divider>
      <Form.Item name={['rates', 'basis']} label="Basis">
        <Radio.Group options={[{ value: 'per_mile', label: 'Per mile' }, { value: 'per_day', label: 'Per day' }]} />
      </Form.Item>
      <Row gutter={12}>
        <Col xs={12} md={8}><Form.Item name={['rates', 'perMileUsd']} label="Per mile (USD)" rules={basis === 'per_mile' ? [{ required: true }] : []}><InputNumber min={0} step={0.05} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={12} md={8}><Form.Item name={['rates', 'perDayUsd']} label="Per day (USD)" rules={basis === 'per_day' ? [{ required: true }] : []}><InputNumber min={0} step={25} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={12} md={8}><Form.Item name={['rates', 'minimumUsd']} label="Minimum (USD)"><InputNumber min={0} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={12} md={8}><Form.Item name={['rates', 'noGoUsd']} label="No-go fee (USD)"><InputNumber min={0} style={{ width: '100%' }} /></Form.Item></Col>
        <Col xs={12} md={8}><Form.Item name={['rates', 'layoverUsd']} label="Layover per day (USD)"><InputNumber min={0} style={{ width: '100%' }} /></Form.Item></Col>
      </Row>
      <Form.Item name="notes" label="Notes"><Input.TextArea rows={2} maxLength={2000} /></Form.Item>
      {vendor && (
        <Form.Item name="active" label="Active (offered for bookings)" valuePropName="checked"><Switch /></Form.Item>
      )}
      {unplaced.length > 0 && <Alert type="error" showIcon style={{ marginBottom: 12 }} title={unplaced.join('; ')} />}
      <Typography.Paragraph type="secondary" style={{ fontSize: 12 }}>Vendors have no account: they answer booking requests through the link in each e-mail.</Typography.Paragraph>
      <Button type="primary" htmlType="submit" loading={create.isPending || update.isPending} data-testid="save-vendor">Save vendor</Button>
    </Form>
  );
}
