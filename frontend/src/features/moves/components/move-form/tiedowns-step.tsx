/** Step 4: the tiedowns of each piece, with the count 49 CFR 393.110 (and 393.130) asks for. */
import { Alert, Button, Card, Checkbox, Col, Form, Input, InputNumber, Row, Select, Space } from 'antd';
import type { TrailerDto } from '@amberline/common';
import { newTiedown, type MoveDraft } from '../../draft';
import { requiredTiedowns } from '../live-feedback';
import { CHAIN_GRADES, CHAIN_SIZES, PATHS, WEBBING_WIDTHS, inches, stepStyle } from './options';

type Props = { hidden: boolean; values: MoveDraft; trailer: TrailerDto | undefined; anchorOptions: { value: string; label: string }[] };

export function TiedownsStep({ hidden, values, trailer, anchorOptions }: Props) {
  return (
        <div style={stepStyle(hidden)}>
          {!trailer && <Alert type="info" showIcon title="Pick the trailer first: the anchor points come from it." style={{ marginBottom: 12 }} />}
          {(values.articles ?? []).map((a, i) => {
            const need = requiredTiedowns(inches(a.length), a.weightLb, !!a.blockedForward, !!a.heavyEquipment);
            return (
              <Card key={i} size="small" title={`Tiedowns for ${a.id || `piece ${i + 1}`}`} style={{ marginBottom: 12 }} extra={need !== null && <span data-testid={`tiedowns-needed-${i}`}>at least {need} (49 CFR 393.110{a.heavyEquipment ? ', 393.130' : ''})</span>}>
                <Form.List name={['articles', i, 'tiedowns']}>
                  {(fields, { add, remove }) => (
                    <>
                      {fields.map((f, k) => {
                        const t = a.tiedowns?.[k] ?? {};
                        return (
                          <Row gutter={8} key={f.key} align="bottom" style={{ borderBottom: '1px dashed #e2e8f0', marginBottom: 8 }} data-testid={`tiedown-${i}-${k}`}>
                            <Col xs={12} sm={6}>
                              <Form.Item name={[f.name, 'label']} label="Label" rules={[{ max: 60 }]}>
                                <Input />
                              </Form.Item>
                            </Col>
                            <Col xs={12} sm={5}>
                              <Form.Item name={[f.name, 'kind']} label="Kind" rules={[{ required: true }]}>
                                <Select options={[{ value: 'chain', label: 'Chain' }, { value: 'webbing', label: 'Webbing' }, { value: 'other', label: 'Other' }]} />
                              </Form.Item>
                            </Col>
                            {t.kind === 'chain' && (
                              <>
                                <Col xs={12} sm={4}>
                                  <Form.Item name={[f.name, 'chainSize']} label="Size" rules={[{ required: !t.markedWllLb, message: 'size' }]}>
                                    <Select options={CHAIN_SIZES} />
                                  </Form.Item>
                                </Col>
                                <Col xs={12} sm={4}>
                                  <Form.Item name={[f.name, 'chainGrade']} label="Grade">
                                    <Select options={CHAIN_GRADES} allowClear placeholder="unmarked" />
                                  </Form.Item>
                                </Col>
                              </>
                            )}
                            {t.kind === 'webbing' && (
                              <Col xs={12} sm={5}>
                                <Form.Item name={[f.name, 'webbingWidth']} label="Width" rules={[{ required: !t.markedWllLb, message: 'width' }]}>
                                  <Select options={WEBBING_WIDTHS} />
                                </Form.Item>
                              </Col>
                            )}
                            <Col xs={12} sm={5}>
                              <Form.Item
                                name={[f.name, 'markedWllLb']}
                                label="Marked WLL"
                                rules={[{ required: t.kind === 'other', message: 'needed for this kind' }, { type: 'number', min: 100, max: 100_000 }]}
                              >
                                <InputNumber style={{ width: '100%' }} suffix="lb" placeholder="table" />
                              </Form.Item>
                            </Col>
                            <Col xs={12} sm={8}>
                              <Form.Item name={[f.name, 'anchorKind']} label="Anchored at" rules={[{ required: true, message: 'anchor' }]}>
                                <Select options={anchorOptions} data-testid={`f-tiedown-${i}-${k}-anchor`} />
                              </Form.Item>
                            </Col>
                            <Col xs={12} sm={10}>
                              <Form.Item name={[f.name, 'path']} label="Path" rules={[{ required: true }]}>
                                <Select options={PATHS} />
                              </Form.Item>
                            </Col>
                            <Col xs={16} sm={4}>
                              <Form.Item name={[f.name, 'edgeProtection']} valuePropName="checked" label=" ">
                                <Checkbox>Edge guard</Checkbox>
                              </Form.Item>
                            </Col>
                            <Col xs={8} sm={2}>
                              <Form.Item label=" ">
                                <Button type="link" danger onClick={() => remove(f.name)} aria-label={`remove tiedown ${k + 1}`}>
                                  ✕
                                </Button>
                              </Form.Item>
                            </Col>
                          </Row>
                        );
                      })}
                      <Space wrap>
                        <Button
                          onClick={() => {
                            const last = a.tiedowns?.[a.tiedowns.length - 1];
                            const base = last ? { ...last, label: `${last.kind ?? 'tiedown'} ${fields.length + 1}` } : { ...newTiedown(fields.length + 1), anchorKind: anchorOptions[0]?.value ?? 'stake_pocket' };
                            add(base);
                          }}
                          data-testid={`add-tiedown-${i}`}
                        >
                          Add a tiedown{a.tiedowns?.length ? ' like the last' : ''}
                        </Button>
                        {need !== null && (a.tiedowns?.length ?? 0) < need && (
                          <Button
                            onClick={() => {
                              const last = a.tiedowns?.[a.tiedowns.length - 1] ?? { ...newTiedown(1), anchorKind: anchorOptions[0]?.value ?? 'stake_pocket' };
                              const start = a.tiedowns?.length ?? 0;
                              for (let n = start; n < need; n++) add({ ...last, label: `${last.kind ?? 'tiedown'} ${n + 1}` });
                            }}
                            data-testid={`fill-tiedowns-${i}`}
                          >
                            Add up to {need}
                          </Button>
                        )}
                      </Space>
                    </>
                  )}
                </Form.List>
              </Card>
            );
          })}
        </div>
  );
}
