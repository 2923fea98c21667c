import { App, Button, Checkbox, Form, Input, InputNumber, Typography } from 'antd';
import { DEPARTURE_TOLERANCE_IN, GAUGE_PLAN_DIFF_LIMIT, parseFeetInches, type DepartureChecksRequest, type RunSheetDto } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { useSubmitDepartureChecks } from '../api/submit-departure-checks';
import { ftIn } from '../format';

type Values = {
  height: string;
  width: string;
  length: string;
  sliderPinsLocked: boolean;
  tiresInflated: boolean;
  markingsInPlace: boolean;
  permitsOnBoard: boolean;
  psi: number | null;
  scaleLb: number | null;
  scaleTicket?: string;
};

const FIELD_OF: Record<string, keyof Values> = {
  measuredHeightIn: 'height',
  measuredWidthIn: 'width',
  measuredLengthIn: 'length',
  sliderPinsLocked: 'sliderPinsLocked',
  tiresInflated: 'tiresInflated',
  markingsInPlace: 'markingsInPlace',
  permitsOnBoard: 'permitsOnBoard',
  'gaugeReadings[0].psi': 'psi',
  'scaleWeights[0].lb': 'scaleLb',
  'scaleWeights[0].ticket': 'scaleTicket',
};

const feetInchesRule = {
  validator: (_: unknown, v: string) => {
    if (!v || !v.trim()) return Promise.reject(new Error('Enter the measurement, like 14\'2"'));
    try {
      parseFeetInches(v);
      return Promise.resolve();
    } catch (e) {
      return Promise.reject(e instanceof Error ? e : new Error(String(e)));
    }
  },
};

/** What the driver measures and confirms before leaving. The server decides the outcome and alerts the dispatcher. */
export function DepartureChecksForm({ sheet }: { sheet: RunSheetDto }) {
  const [form] = Form.useForm<Values>();
  const { message } = App.useApp();
  const submit = useSubmitDepartureChecks();
  const target = sheet.checkAgainst;
  const against = target.source === 'permit' ? 'permitted' : 'planned';

  const onFinish = async (v: Values) => {
    const body: DepartureChecksRequest = {
      measuredHeightIn: parseFeetInches(v.height),
      measuredWidthIn: parseFeetInches(v.width),
      measuredLengthIn: parseFeetInches(v.length),
      sliderPinsLocked: !!v.sliderPinsLocked,
      tiresInflated: !!v.tiresInflated,
      markingsInPlace: !!v.markingsInPlace,
      permitsOnBoard: !!v.permitsOnBoard,
      gaugeReadings: v.psi === null || v.psi === undefined ? [] : [{ group: 'trailer', psi: v.psi }],
      ...(v.scaleLb ? { scaleWeights: [{ group: 'trailer' as const, lb: v.scaleLb, ...(v.scaleTicket?.trim() ? { ticket: v.scaleTicket.trim() } : {}) }] } : {}),
    };
    try {
      const res = await submit.mutateAsync({ moveId: sheet.move.id, ...body });
      if (res.outcome === 'blocked') message.error('Do not depart: the checks found a problem. Your dispatcher has been told.');
      else message.success('Departure checks recorded.');
    } catch (e) {
      if (e instanceof ApiError) {
        const fields = e.fieldErrors().map((f) => ({ name: FIELD_OF[f.name] ?? f.name, errors: f.errors })).filter((f) => Object.values(FIELD_OF).includes(f.name as keyof Values));
        if (fields.length) form.setFields(fields as { name: keyof Values; errors: string[] }[]);
        message.error(e.message);
      } else message.error('The checks could not be sent; try again.');
    }
  };

  const measure = (name: 'height' | 'width' | 'length', label: string, planned: number, tol: number) => (
    <Form.Item
      name={name}
      label={label}
      rules={[feetInchesRule]}
      extra={`${against} ${ftIn(planned)} · tolerance ${tol} in`}
      style={{ marginBottom: 12 }}
    >
      <Input inputMode="text" autoComplete="off" placeholder={`e.g. ${ftIn(planned)}`} size="large" data-testid={`measured-${name}`} />
    </Form.Item>
  );

  return (
    <Form form={form} layout="vertical" onFinish={onFinish} requiredMark={false} data-testid="departure-checks-form" initialValues={{ psi: null, scaleLb: null }}>
      <Typography.Paragraph type="secondary" style={{ fontSize: 13 }}>
        Measure the loaded combination with a tape or a measuring pole. Feet and inches, like 14&apos;2&quot;.
      </Typography.Paragraph>
      <div style={{ display: 'grid', gridTemplateColumns: 'repeat(auto-fill, minmax(150px, 1fr))', columnGap: 12 }}>
        {measure('height', 'Measured height', target.heightIn, DEPARTURE_TOLERANCE_IN.height)}
        {measure('width', 'Measured width', target.widthIn, DEPARTURE_TOLERANCE_IN.width)}
        {measure('length', 'Measured length', target.lengthIn, DEPARTURE_TOLERANCE_IN.length)}
      </div>
      <Form.Item name="sliderPinsLocked" valuePropName="checked" style={{ marginBottom: 4 }}>
        <Checkbox data-testid="check-pins">
          Sliding-axle pins locked{sheet.axles.sliderSettingFt !== null ? ` at ${sheet.axles.sliderSettingFt} ft` : ''}
        </Checkbox>
      </Form.Item>
      <Form.Item name="tiresInflated" valuePropName="checked" style={{ marginBottom: 4 }}>
        <Checkbox data-testid="check-tires">Tires properly inflated</Checkbox>
      </Form.Item>
      <Form.Item name="markingsInPlace" valuePropName="checked" style={{ marginBottom: 4 }}>
        <Checkbox data-testid="check-markings">Flags, signs and lamps in place as drawn</Checkbox>
      </Form.Item>
      <Form.Item name="permitsOnBoard" valuePropName="checked" style={{ marginBottom: 12 }}>
        <Checkbox data-testid="check-permits">Permits on board</Checkbox>
      </Form.Item>
      <Form.Item
        name="psi"
        label="Trailer air-suspension gauge (psi)"
        extra={
          sheet.gaugeCalibration.length >= 2
            ? 'Gives an estimated trailer-group load from this trailer’s calibration. Leave empty if the trailer has no gauge.'
            : 'This trailer has no gauge calibration: no load estimate can be made.'
        }
        style={{ marginBottom: 12 }}
      >
        <InputNumber min={0} max={150} step={0.5} inputMode="decimal" size="large" style={{ width: 160 }} suffix="psi" data-testid="gauge-psi" />
      </Form.Item>
      <Form.Item
        name="scaleLb"
        label="Certified scale weight, trailer group (lb)"
        extra={`If you weighed the trailer group on a certified scale. A gauge estimate more than ${Math.round(GAUGE_PLAN_DIFF_LIMIT * 100)} % off the plan blocks departure until a scale weight is recorded or the dispatcher overrides it.`}
        style={{ marginBottom: 8 }}
      >
        <InputNumber min={1000} max={200000} step={10} inputMode="numeric" size="large" style={{ width: 200 }} suffix="lb" data-testid="scale-lb" />
      </Form.Item>
      <Form.Item name="scaleTicket" label="Scale ticket number" style={{ marginBottom: 12 }}>
        <Input size="large" maxLength={60} style={{ width: 200 }} data-testid="scale-ticket" />
      </Form.Item>
      <Button type="primary" htmlType="submit" size="large" block loading={submit.isPending} data-testid="submit-checks">
        Record departure checks
      </Button>
    </Form>
  );
}
