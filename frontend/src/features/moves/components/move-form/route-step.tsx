/** Step 5: origin and destination, the route segment by segment, departure, travel days and the driver. */
import { Button, Card, Checkbox, Col, DatePicker, Form, Input, InputNumber, Row, Select, Space, Typography } from 'antd';
import dayjs from 'dayjs';
import { JURISDICTIONS } from '@amberline/common';
import { newSegment } from '../../draft';
import type { DriverOption } from '../../api/get-drivers';
import { ROAD_TYPES, stepStyle, type FleetList } from './options';

export function RouteStep({ hidden, drivers }: { hidden: boolean; drivers: FleetList<DriverOption> }) {
  const today = dayjs().startOf('day');
  return (
        <div style={stepStyle(hidden)}>
          <Row gutter={12}>
            <Col xs={24} sm={12}>
              <Form.Item name="origin" label="Origin" rules={[{ required: true, whitespace: true, message: 'Where does it load?' }, { max: 200 }]}>
                <Input placeholder="City, ST" data-testid="f-origin" />
              </Form.Item>
            </Col>
            <Col xs={24} sm={12}>
              <Form.Item name="destination" label="Destination" rules={[{ required: true, whitespace: true, message: 'Where does it go?' }, { max: 200 }]}>
                <Input placeholder="City, ST" data-testid="f-destination" />
              </Form.Item>
            </Col>
          </Row>
          <Typography.Title level={5}>Route, in order</Typography.Title>
          <Form.List name="route">
            {(fields, { add, remove, move: moveSeg }) => (
              <>
                {fields.map((f, i) => (
                  <Card key={f.key} size="small" style={{ marginBottom: 8 }} title={`Segment ${i + 1}`} data-testid={`segment-${i}`}
                    extra={
                      <Space size={0}>
                        <Button type="link" size="small" disabled={i === 0} onClick={() => moveSeg(i, i - 1)} aria-label="move up">↑</Button>
                        <Button type="link" size="small" disabled={i === fields.length - 1} onClick={() => moveSeg(i, i + 1)} aria-label="move down">↓</Button>
                        {fields.length > 1 && <Button type="link" size="small" danger onClick={() => remove(f.name)}>Remove</Button>}
                      </Space>
                    }
                  >
                    <Row gutter={8}>
                      <Col xs={12} sm={6}>
                        <Form.Item name={[f.name, 'jurisdiction']} label="State" rules={[{ required: true, message: 'state' }]}>
                          <Select showSearch={{ optionFilterProp: 'label' }} options={JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} · ${j.name}` }))} data-testid={`f-seg-${i}-state`} />
                        </Form.Item>
                      </Col>
                      <Col xs={12} sm={10}>
                        <Form.Item name={[f.name, 'roads']} label="Roads" rules={[{ required: true, whitespace: true, message: 'roads' }, { max: 200 }]}>
                          <Input placeholder="US 290, I-10 W" data-testid={`f-seg-${i}-roads`} />
                        </Form.Item>
                      </Col>
                      <Col xs={12} sm={4}>
                        <Form.Item name={[f.name, 'miles']} label="Miles" rules={[{ required: true, message: 'miles' }, { type: 'number', min: 0.1, max: 3000 }]}>
                          <InputNumber style={{ width: '100%' }} min={0.1} data-testid={`f-seg-${i}-miles`} />
                        </Form.Item>
                      </Col>
                      <Col xs={12} sm={4}>
                        <Form.Item name={[f.name, 'zip']} label="ZIP" rules={[{ pattern: /^\d{5}$/, message: '5 digits' }]} tooltip="A ZIP code on the segment, for sunrise and sunset">
                          <Input maxLength={5} data-testid={`f-seg-${i}-zip`} />
                        </Form.Item>
                      </Col>
                      <Col xs={16} sm={8}>
                        <Form.Item name={[f.name, 'roadType']} label="Road type" rules={[{ required: true }]}>
                          <Select options={ROAD_TYPES} data-testid={`f-seg-${i}-roadtype`} />
                        </Form.Item>
                      </Col>
                      <Col xs={8} sm={6}>
                        <Form.Item name={[f.name, 'urban']} valuePropName="checked" label=" ">
                          <Checkbox>In town</Checkbox>
                        </Form.Item>
                      </Col>
                    </Row>
                  </Card>
                ))}
                <Button onClick={() => add(newSegment())} disabled={fields.length >= 30} data-testid="add-segment">
                  Add a segment
                </Button>
              </>
            )}
          </Form.List>
          <Row gutter={12} style={{ marginTop: 16 }}>
            <Col xs={12} sm={8}>
              <Form.Item name="requestedDeparture" label="Departure" rules={[{ required: true, message: 'Pick the day' }]}>
                <DatePicker style={{ width: '100%' }} disabledDate={(d) => d.isBefore(today)} format="YYYY-MM-DD" data-testid="f-departure" />
              </Form.Item>
            </Col>
            <Col xs={12} sm={6}>
              <Form.Item name="travelDays" label="Travel days" rules={[{ required: true }, { type: 'number', min: 1, max: 30 }]}>
                <InputNumber style={{ width: '100%' }} min={1} max={30} />
              </Form.Item>
            </Col>
            <Col xs={24} sm={10}>
              <Form.Item name="driverId" label="Driver">
                <Select allowClear placeholder="assign later" loading={drivers.isPending} options={(drivers.data ?? []).map((d) => ({ value: d.id, label: d.name }))} data-testid="f-driver" />
              </Form.Item>
            </Col>
          </Row>
        </div>
  );
}
