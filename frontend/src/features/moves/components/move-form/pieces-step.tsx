/** Step 2: the load pieces: mark, size, weight and where it comes from, center of gravity, handling. */
import { Button, Card, Checkbox, Col, Form, Input, InputNumber, Row, Select, Space } from 'antd';
import { WEIGHT_SOURCES } from '@amberline/common';
import { feetInchesRule, newArticle, type MoveDraft } from '../../draft';
import { WEIGHT_SOURCE_LABELS, inches, stepStyle } from './options';

export function PiecesStep({ hidden, values }: { hidden: boolean; values: MoveDraft }) {
  return (
        <div style={stepStyle(hidden)}>
          <Form.List name="articles">
            {(fields, { add, remove }) => (
              <>
                {fields.map((f, i) => (
                  <Card
                    key={f.key}
                    size="small"
                    title={`Piece ${i + 1}`}
                    style={{ marginBottom: 12 }}
                    extra={fields.length > 1 && <Button size="small" danger type="link" onClick={() => remove(f.name)}>Remove</Button>}
                    data-testid={`piece-${i}`}
                  >
                    <Row gutter={12}>
                      <Col xs={8} sm={6}>
                        <Form.Item name={[f.name, 'id']} label="Mark" rules={[{ required: true, whitespace: true, message: 'Give a short mark' }, { max: 40 }]}>
                          <Input />
                        </Form.Item>
                      </Col>
                      <Col xs={16} sm={18}>
                        <Form.Item name={[f.name, 'description']} label="Description" rules={[{ max: 200 }]}>
                          <Input data-testid={`f-piece-${i}-description`} />
                        </Form.Item>
                      </Col>
                      {(['length', 'width', 'height'] as const).map((k) => (
                        <Col xs={8} key={k}>
                          <Form.Item name={[f.name, k]} label={`${k[0].toUpperCase()}${k.slice(1)}`} rules={[feetInchesRule(k)]} extra={inches(values.articles?.[i]?.[k]) ? `${inches(values.articles?.[i]?.[k])} in` : `e.g. 10'6"`}>
                            <Input placeholder={`ft' in"`} data-testid={`f-piece-${i}-${k}`} />
                          </Form.Item>
                        </Col>
                      ))}
                      <Col xs={12} sm={8}>
                        <Form.Item name={[f.name, 'weightLb']} label="Weight" rules={[{ required: true, message: 'Enter the weight' }, { type: 'number', min: 1, max: 1_000_000, message: 'between 1 and 1,000,000 lb' }]}>
                          <InputNumber<number>
                            style={{ width: '100%' }}
                            suffix="lb"
                            min={1}
                            max={1_000_000}
                            formatter={(v) => (v === undefined || v === null || v === ('' as unknown) ? '' : `${v}`.replace(/\B(?=(\d{3})+(?!\d))/g, ','))}
                            parser={(v) => Number((v ?? '').replace(/,/g, ''))}
                            data-testid={`f-piece-${i}-weight`}
                          />
                        </Form.Item>
                      </Col>
                      <Col xs={12} sm={8}>
                        <Form.Item name={[f.name, 'weightSource']} label="Weight from" rules={[{ required: true }]}>
                          <Select options={WEIGHT_SOURCES.map((s) => ({ value: s, label: WEIGHT_SOURCE_LABELS[s] }))} />
                        </Form.Item>
                      </Col>
                      <Col xs={24} sm={8}>
                        <Form.Item name={[f.name, 'cg']} label="Center of gravity" rules={[feetInchesRule('center of gravity', { required: false, positive: false })]} extra="behind the piece's front; empty = middle">
                          <Input placeholder={`ft' in"`} />
                        </Form.Item>
                      </Col>
                    </Row>
                    <Space wrap>
                      <Form.Item name={[f.name, 'sharpEdges']} valuePropName="checked" noStyle>
                        <Checkbox>Sharp edges</Checkbox>
                      </Form.Item>
                      <Form.Item name={[f.name, 'heavyEquipment']} valuePropName="checked" noStyle>
                        <Checkbox data-testid={`f-piece-${i}-heavy`}>Heavy equipment or machinery</Checkbox>
                      </Form.Item>
                      <Form.Item name={[f.name, 'blockedForward']} valuePropName="checked" noStyle>
                        <Checkbox>Blocked against forward movement</Checkbox>
                      </Form.Item>
                    </Space>
                  </Card>
                ))}
                <Button onClick={() => add(newArticle(fields.length + 1))} disabled={fields.length >= 10} data-testid="add-piece">
                  Add a piece
                </Button>
              </>
            )}
          </Form.List>
        </div>
  );
}
