/** Admin forms for a tractor and a trailer, in a drawer. Lengths in inches, distances along the combination in feet. */
import { useEffect, useState } from 'react';
import { Alert, App, Button, Col, Drawer, Form, Input, InputNumber, Row, Select, Space, Switch, Typography, type FormInstance } from 'antd';
import {
  ANCHOR_KIND_LABELS,
  ANCHOR_KINDS,
  formatFeetInches,
  TRAILER_TYPE_LABELS,
  TRAILER_TYPES,
  type TractorDto,
  type TractorInput,
  type TrailerDto,
  type TrailerInput,
} from '@amberline/common';
import { applyApiFieldErrors } from '../../../components/form-errors';
import { ApiError } from '../../../lib/api-client';
import { useCreateTractor } from '../api/create-tractor';
import { useCreateTrailer } from '../api/create-trailer';
import { useUpdateTractor } from '../api/update-tractor';
import { useUpdateTrailer } from '../api/update-trailer';

const num = (suffix: string, props: Record<string, unknown> = {}) => <InputNumber style={{ width: '100%' }} suffix={suffix} {...props} />;

function FeetHint({ inches }: { inches?: number | null }) {
  if (typeof inches !== 'number' || !(inches >= 0)) return null;
  return <span>{formatFeetInches(inches)}</span>;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
function useSave<T>(onClose: () => void, form: FormInstance<any>) {
  const { message } = App.useApp();
  const [issues, setIssues] = useState<string[]>([]);
  const onError = (e: Error) => {
    const unplaced = applyApiFieldErrors(form, e);
    if (unplaced === null) {
      message.error(e instanceof ApiError && e.status === 409 ? `${e.message}` : e.message);
      setIssues([e.message]);
    } else setIssues(unplaced);
  };
  const onSuccess = (label: string) => (saved: T & { unitNumber: string }) => {
    message.success(`${saved.unitNumber} ${label}`);
    setIssues([]);
    onClose();
  };
  return { issues, setIssues, onError, onSuccess };
}

function Issues({ issues }: { issues: string[] }) {
  if (!issues.length) return null;
  return <Alert type="error" showIcon title="Not saved" description={<ul style={{ margin: 0, paddingLeft: 18 }}>{issues.map((i) => <li key={i}>{i}</li>)}</ul>} style={{ marginBottom: 12 }} />;
}

type TractorForm = Omit<TractorInput, 'fifthWheelRangeFt'> & { slidingFifthWheel?: boolean; fifthWheelRangeFt?: { min: number; max: number } | null };

export function TractorDrawer({ open, tractor, onClose }: { open: boolean; tractor: TractorDto | null; onClose: () => void }) {
  const [form] = Form.useForm<TractorForm>();
  const create = useCreateTractor();
  const update = useUpdateTractor();
  const save = useSave<TractorDto>(onClose, form);
  const sliding = Form.useWatch('slidingFifthWheel', form);

  useEffect(() => {
    if (!open) return;
    form.resetFields();
    save.setIssues([]);
    if (tractor) {
      const { id: _id, active: _a, version: _v, updatedAt: _u, ...spec } = tractor;
      form.setFieldsValue({ ...spec, slidingFifthWheel: !!spec.fifthWheelRangeFt });
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [open, tractor]);

  const submit = (v: TractorForm) => {
    const { slidingFifthWheel, ...rest } = v;
    const body: TractorInput = { ...rest, fifthWheelRangeFt: slidingFifthWheel && rest.fifthWheelRangeFt ? rest.fifthWheelRangeFt : null };
    if (tractor) update.mutate({ id: tractor.id, version: tractor.version, body }, { onSuccess: save.onSuccess('saved'), onError: save.onError });
    else create.mutate(body, { onSuccess: save.onSuccess('added'), onError: save.onError });
  };

  return (
    <Drawer open={open} onClose={onClose} size="large" title={tractor ? `Tractor ${tractor.unitNumber}` : 'New tractor'} destroyOnHidden
      extra={<Button type="primary" onClick={() => form.submit()} loading={create.isPending || update.isPending} data-testid="save-tractor">Save</Button>}>
      <Issues issues={save.issues} />
      <Form<TractorForm>
        form={form}
        layout="vertical"
        onFinish={submit}
        initialValues={{ steerTareLb: 10_800, driveTareLb: 8_700, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1, bumperToSteerIn: 42, widthIn: 102, heightIn: 162, driveAxleOffsetsFt: [-2.125, 2.125] }}
      >
        <Row gutter={12}>
          <Col xs={12}><Form.Item name="unitNumber" label="Unit number" rules={[{ required: true, whitespace: true }, { max: 40 }]}><Input /></Form.Item></Col>
          <Col xs={12}><Form.Item name="plate" label="Plate" rules={[{ required: true, whitespace: true }, { max: 20 }]}><Input /></Form.Item></Col>
          <Col xs={12}><Form.Item name="steerTareLb" label="Steer axle, empty" rules={[{ required: true }]}>{num('lb', { min: 1000, max: 40000 })}</Form.Item></Col>
          <Col xs={12}><Form.Item name="driveTareLb" label="Drive group, empty" rules={[{ required: true }]}>{num('lb', { min: 1000, max: 60000 })}</Form.Item></Col>
          <Col xs={12}><Form.Item name="wheelbaseFt" label="Wheelbase (steer to drive center)" rules={[{ required: true }]}>{num('ft', { min: 8, max: 35, step: 0.5 })}</Form.Item></Col>
          <Col xs={12}><Form.Item name="fifthWheelAheadOfDriveFt" label="Fifth wheel ahead of drive center" rules={[{ required: true }]} extra="negative = behind">{num('ft', { min: -5, max: 5, step: 0.25 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="bumperToSteerIn" label="Bumper to steer" rules={[{ required: true }]}>{num('in', { min: 0, max: 240 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="widthIn" label="Width" rules={[{ required: true }]}>{num('in', { min: 60, max: 120 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="heightIn" label="Height" rules={[{ required: true }]}>{num('in', { min: 60, max: 170 })}</Form.Item></Col>
        </Row>
        <Form.Item name="slidingFifthWheel" valuePropName="checked" label="Sliding fifth wheel"><Switch /></Form.Item>
        {sliding && (
          <Row gutter={12}>
            <Col xs={12}><Form.Item name={['fifthWheelRangeFt', 'min']} label="From" rules={[{ required: true }]}>{num('ft', { min: -10, max: 10, step: 0.25 })}</Form.Item></Col>
            <Col xs={12}><Form.Item name={['fifthWheelRangeFt', 'max']} label="To" rules={[{ required: true }]}>{num('ft', { min: -10, max: 10, step: 0.25 })}</Form.Item></Col>
          </Row>
        )}
        <Typography.Text strong>Drive axles, from the group center (front to rear)</Typography.Text>
        <Form.List name="driveAxleOffsetsFt" rules={[{ validator: async (_, v) => { if (!v || v.length < 1) throw new Error('at least one drive axle'); } }]}>
          {(fields, { add, remove }, { errors }) => (
            <>
              <Space wrap style={{ margin: '8px 0' }}>
                {fields.map((f) => (
                  <Space.Compact key={f.key}>
                    <Form.Item name={f.name} noStyle rules={[{ required: true }]}>{num('ft', { step: 0.125, style: { width: 110 } })}</Form.Item>
                    <Button onClick={() => remove(f.name)} disabled={fields.length <= 1}>✕</Button>
                  </Space.Compact>
                ))}
                <Button onClick={() => add(0)} disabled={fields.length >= 5}>Add axle</Button>
              </Space>
              <Form.ErrorList errors={errors} />
            </>
          )}
        </Form.List>
      </Form>
    </Drawer>
  );
}

type TrailerForm = Omit<TrailerInput, 'slider'> & { sliding?: boolean; slider?: TrailerInput['slider'] };

export function TrailerDrawer({ open, trailer, onClose }: { open: boolean; trailer: TrailerDto | null; onClose: () => void }) {
  const [form] = Form.useForm<TrailerForm>();
  const create = useCreateTrailer();
  const update = useUpdateTrailer();
  const save = useSave<TrailerDto>(onClose, form);
  const sliding = Form.useWatch('sliding', form);
  const lengthIn = Form.useWatch('lengthIn', form);

  useEffect(() => {
    if (!open) return;
    form.resetFields();
    save.setIssues([]);
    if (trailer) {
      const { id: _id, active: _a, version: _v, updatedAt: _u, ...spec } = trailer;
      form.setFieldsValue({ ...spec, sliding: !!spec.slider });
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [open, trailer]);

  const submit = (v: TrailerForm) => {
    const { sliding: s, ...rest } = v;
    const body: TrailerInput = { ...rest, slider: s && rest.slider ? rest.slider : null, heightIn: rest.heightIn || null, tireSize: rest.tireSize || null, anchorPoints: rest.anchorPoints ?? [], gaugeCalibration: rest.gaugeCalibration ?? [] };
    if (trailer) update.mutate({ id: trailer.id, version: trailer.version, body }, { onSuccess: save.onSuccess('saved'), onError: save.onError });
    else create.mutate(body, { onSuccess: save.onSuccess('added'), onError: save.onError });
  };

  return (
    <Drawer open={open} onClose={onClose} size="large" title={trailer ? `Trailer ${trailer.unitNumber}` : 'New trailer'} destroyOnHidden
      extra={<Button type="primary" onClick={() => form.submit()} loading={create.isPending || update.isPending} data-testid="save-trailer">Save</Button>}>
      <Issues issues={save.issues} />
      <Form<TrailerForm>
        form={form}
        layout="vertical"
        onFinish={submit}
        initialValues={{
          type: 'step_deck',
          lengthIn: 576,
          widthIn: 102,
          decks: [{ name: 'upper deck', fromFrontIn: 0, toFrontIn: 132, heightIn: 60 }, { name: 'lower deck', fromFrontIn: 132, toFrontIn: 576, heightIn: 36 }],
          tareLb: 14_500,
          tareCgFromKingpinFt: 22,
          kingpinFromFrontIn: 36,
          axleOffsetsFt: [-2.05, 2.05],
          axleGroupFromKingpinFt: 39,
          anchorPoints: [{ kind: 'stake_pocket', countPerSide: 12, wllLb: 5000 }],
          gaugeCalibration: [],
        }}
      >
        <Row gutter={12}>
          <Col xs={12}><Form.Item name="unitNumber" label="Unit number" rules={[{ required: true, whitespace: true }, { max: 40 }]}><Input /></Form.Item></Col>
          <Col xs={12}><Form.Item name="type" label="Type" rules={[{ required: true }]}><Select options={TRAILER_TYPES.map((t) => ({ value: t, label: TRAILER_TYPE_LABELS[t] }))} /></Form.Item></Col>
          <Col xs={8}><Form.Item name="lengthIn" label="Length" rules={[{ required: true }]} extra={<FeetHint inches={lengthIn} />}>{num('in', { min: 240, max: 2400 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="widthIn" label="Width" rules={[{ required: true }]}>{num('in', { min: 60, max: 200 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="heightIn" label="Highest fixed part" extra="headboard, gooseneck">{num('in', { min: 0, max: 200 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="tareLb" label="Tare" rules={[{ required: true }]}>{num('lb', { min: 2000, max: 120000 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="tareCgFromKingpinFt" label="Tare center behind kingpin" rules={[{ required: true }]}>{num('ft', { min: 0, max: 200, step: 0.5 })}</Form.Item></Col>
          <Col xs={8}><Form.Item name="kingpinFromFrontIn" label="Kingpin behind the front" rules={[{ required: true }]}>{num('in', { min: 0, max: 600 })}</Form.Item></Col>
          <Col xs={12}><Form.Item name="axleGroupFromKingpinFt" label="Axle group behind kingpin" rules={[{ required: true }]} extra="the usual setting on a sliding axle">{num('ft', { min: 5, max: 200, step: 0.5 })}</Form.Item></Col>
          <Col xs={12}><Form.Item name="tireSize" label="Tire size"><Input placeholder="255/70R22.5" /></Form.Item></Col>
        </Row>

        <Typography.Title level={5}>Deck sections (from the trailer front)</Typography.Title>
        <Form.List name="decks">
          {(fields, { add, remove }) => (
            <>
              {fields.map((f) => (
                <Row gutter={8} key={f.key} align="bottom">
                  <Col xs={24} sm={7}><Form.Item name={[f.name, 'name']} label="Name" rules={[{ required: true }]}><Input /></Form.Item></Col>
                  <Col xs={8} sm={5}><Form.Item name={[f.name, 'fromFrontIn']} label="From" rules={[{ required: true }]}>{num('in', { min: 0 })}</Form.Item></Col>
                  <Col xs={8} sm={5}><Form.Item name={[f.name, 'toFrontIn']} label="To" rules={[{ required: true }]}>{num('in', { min: 1 })}</Form.Item></Col>
                  <Col xs={8} sm={5}><Form.Item name={[f.name, 'heightIn']} label="Height" rules={[{ required: true }]}>{num('in', { min: 6, max: 84 })}</Form.Item></Col>
                  <Col xs={24} sm={2}><Form.Item label=" "><Button onClick={() => remove(f.name)} disabled={fields.length <= 1}>✕</Button></Form.Item></Col>
                </Row>
              ))}
              <Button onClick={() => add({ name: 'deck', fromFrontIn: 0, toFrontIn: 0, heightIn: 36 })} disabled={fields.length >= 5}>Add a section</Button>
            </>
          )}
        </Form.List>

        <Typography.Title level={5}>Axles, from the group center (front to rear)</Typography.Title>
        <Form.List name="axleOffsetsFt">
          {(fields, { add, remove }) => (
            <Space wrap>
              {fields.map((f) => (
                <Space.Compact key={f.key}>
                  <Form.Item name={f.name} noStyle rules={[{ required: true }]}>{num('ft', { step: 0.05, style: { width: 110 } })}</Form.Item>
                  <Button onClick={() => remove(f.name)} disabled={fields.length <= 1}>✕</Button>
                </Space.Compact>
              ))}
              <Button onClick={() => add(0)} disabled={fields.length >= 13}>Add axle</Button>
            </Space>
          )}
        </Form.List>

        <Form.Item name="sliding" valuePropName="checked" label="Sliding axle" style={{ marginTop: 12 }}><Switch /></Form.Item>
        {sliding && (
          <Row gutter={12}>
            <Col xs={8}><Form.Item name={['slider', 'minFromKingpinFt']} label="Closest to kingpin" rules={[{ required: true }]}>{num('ft', { min: 0, max: 200, step: 0.5 })}</Form.Item></Col>
            <Col xs={8}><Form.Item name={['slider', 'maxFromKingpinFt']} label="Farthest" rules={[{ required: true }]}>{num('ft', { min: 0, max: 200, step: 0.5 })}</Form.Item></Col>
            <Col xs={8}><Form.Item name={['slider', 'holeSpacingIn']} label="Hole spacing" rules={[{ required: true }]}>{num('in', { min: 1, max: 60 })}</Form.Item></Col>
          </Row>
        )}

        <Typography.Title level={5}>Anchor points</Typography.Title>
        <Form.List name="anchorPoints">
          {(fields, { add, remove }) => (
            <>
              {fields.map((f) => (
                <Row gutter={8} key={f.key} align="bottom">
                  <Col xs={24} sm={10}><Form.Item name={[f.name, 'kind']} label="Kind" rules={[{ required: true }]}><Select options={ANCHOR_KINDS.map((k) => ({ value: k, label: ANCHOR_KIND_LABELS[k] }))} /></Form.Item></Col>
                  <Col xs={10} sm={6}><Form.Item name={[f.name, 'countPerSide']} label="Per side" rules={[{ required: true }]}>{num('', { min: 0, max: 60, precision: 0 })}</Form.Item></Col>
                  <Col xs={10} sm={6}><Form.Item name={[f.name, 'wllLb']} label="Rated WLL" rules={[{ required: true }]}>{num('lb', { min: 1, max: 100000 })}</Form.Item></Col>
                  <Col xs={4} sm={2}><Form.Item label=" "><Button onClick={() => remove(f.name)}>✕</Button></Form.Item></Col>
                </Row>
              ))}
              <Button onClick={() => add({ kind: 'stake_pocket', countPerSide: 10, wllLb: 5000 })} disabled={fields.length >= 10}>Add anchor points</Button>
            </>
          )}
        </Form.List>

        <Typography.Title level={5}>Air-gauge calibration (certified scale readings)</Typography.Title>
        <Form.List name="gaugeCalibration">
          {(fields, { add, remove }) => (
            <>
              {fields.map((f) => (
                <Row gutter={8} key={f.key} align="bottom">
                  <Col xs={10}><Form.Item name={[f.name, 'psi']} label="Gauge" rules={[{ required: true }]}>{num('psi', { min: 0, max: 150 })}</Form.Item></Col>
                  <Col xs={10}><Form.Item name={[f.name, 'loadLb']} label="Scale load" rules={[{ required: true }]}>{num('lb', { min: 0, max: 200000 })}</Form.Item></Col>
                  <Col xs={4}><Form.Item label=" "><Button onClick={() => remove(f.name)}>✕</Button></Form.Item></Col>
                </Row>
              ))}
              <Button onClick={() => add({ psi: 0, loadLb: 0 })} disabled={fields.length >= 20}>Add a reading</Button>
            </>
          )}
        </Form.List>
      </Form>
    </Drawer>
  );
}
