/** The move form in steps, with live feedback beside it. Used for new moves and for editing one. */
import { useEffect, useMemo, useRef, useState } from 'react';
import {
  Alert,
  App,
  Button,
  Card,
  Checkbox,
  Col,
  DatePicker,
  Form,
  Input,
  InputNumber,
  Row,
  Select,
  Slider,
  Space,
  Steps,
  Typography,
} from 'antd';
import dayjs from 'dayjs';
import { useNavigate } from 'react-router-dom';
import {
  ANCHOR_KIND_LABELS,
  formatFeetInches,
  formatPounds,
  JURISDICTIONS,
  parseFeetInches,
  TRAILER_TYPE_LABELS,
  WEIGHT_SOURCES,
  type MoveDto,
  type MoveInput,
  type RoadType,
  type WeightSource,
} from '@amberline/common';
import { ApiError, isVersionConflict } from '../../../lib/api-client';
import { applyApiFieldErrors } from '../../../components/form-errors';
import { to } from '../../../config/paths';
import { useTractors } from '../../fleet/api/get-tractors';
import { useTrailers } from '../../fleet/api/get-trailers';
import { useCreateMove } from '../api/create-move';
import { useDrivers } from '../api/get-drivers';
import { usePreviewMove } from '../api/preview-move';
import { useUpdateMove } from '../api/update-move';
import {
  articleFromDraft,
  draftToInput,
  feetInchesRule,
  formFieldPath,
  instantAxles,
  moveToDraft,
  newArticle,
  newSegment,
  newTiedown,
  stepOfField,
  type MoveDraft,
} from '../draft';
import { LiveFeedback, requiredTiedowns } from './live-feedback';

const STEPS = ['Customer', 'Load pieces', 'Equipment', 'Tiedowns', 'Route and dates'];

const WEIGHT_SOURCE_LABELS: Record<WeightSource, string> = { spec_sheet: 'Spec sheet', scale_ticket: 'Scale ticket', estimate: 'Estimate' };
const ROAD_TYPES: { value: RoadType; label: string }[] = [
  { value: 'two-lane', label: 'Two-lane' },
  { value: 'multilane', label: 'Multilane / divided' },
  { value: 'interstate', label: 'Interstate' },
];
const PATHS = [
  { value: 'direct', label: 'Direct (half credited)' },
  { value: 'same-side', label: 'Returns to the same side (half credited)' },
  { value: 'side-to-side', label: 'Side to side, over the load (full credit)' },
];
const CHAIN_SIZES = ['5/16', '3/8', '1/2', '5/8'].map((v) => ({ value: v, label: `${v} in` }));
const CHAIN_GRADES = [30, 43, 70, 80, 100].map((v) => ({ value: v, label: `grade ${v}` }));
const WEBBING_WIDTHS = ['1 3/4', '2', '3', '4'].map((v) => ({ value: v, label: `${v} in` }));

/** Debounces a value: the preview goes to the server ~400 ms after the dispatcher stops typing. */
function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

const inches = (text: string | undefined): number | undefined => {
  try {
    return text ? parseFeetInches(text) : undefined;
  } catch {
    return undefined;
  }
};

export function MoveForm({ move }: { move?: MoveDto }) {
  const { message } = App.useApp();
  const navigate = useNavigate();
  const [form] = Form.useForm<MoveDraft>();
  const [step, setStep] = useState(0);
  const [stepErrors, setStepErrors] = useState<Set<number>>(new Set());
  const [serverIssues, setServerIssues] = useState<string[]>([]);
  const [stale, setStale] = useState(false);
  const loadedVersion = useRef<number | null>(null);
  const tractors = useTractors();
  const trailers = useTrailers();
  const drivers = useDrivers();
  const create = useCreateMove();
  const update = useUpdateMove();

  useEffect(() => {
    if (move && loadedVersion.current === null) {
      form.setFieldsValue(moveToDraft(move));
      loadedVersion.current = move.version;
    }
  }, [move, form]);

  const values = (Form.useWatch([], form) ?? {}) as MoveDraft;
  const tractor = tractors.data?.find((t) => t.id === values.tractorId);
  const trailer = trailers.data?.find((t) => t.id === values.trailerId);

  const pieces = useMemo(() => (values.articles ?? []).map((a, i) => articleFromDraft(a, i).article).filter((a): a is NonNullable<typeof a> => a !== null), [values.articles]);
  const instant = useMemo(() => instantAxles(pieces, tractor, trailer, values.sliderSettingFt), [pieces, tractor, trailer, values.sliderSettingFt]);
  const conversion = useMemo(() => draftToInput(values, { forPreview: true }), [values]);
  const previewKey = useDebounced(conversion.input ? JSON.stringify(conversion.input) : null, 400);
  const previewBody = useMemo(() => (previewKey ? (JSON.parse(previewKey) as MoveInput) : null), [previewKey]);
  const preview = usePreviewMove(previewBody);
  const previewStale = preview.isPlaceholderData || (conversion.input !== null && JSON.stringify(conversion.input) !== previewKey);

  const onTrailerChange = (id: string) => {
    const t = trailers.data?.find((x) => x.id === id);
    form.setFieldValue('sliderSettingFt', t?.slider ? t.axleGroupFromKingpinFt : null);
  };

  const markErrors = () => {
    const failing = new Set<number>();
    for (const f of form.getFieldsError()) if (f.errors.length) failing.add(stepOfField(f.name as (string | number)[]));
    setStepErrors(failing);
    return failing;
  };

  const handleApiError = (e: Error) => {
    if (!(e instanceof ApiError)) return message.error(e.message);
    if (e.status === 409 && move) {
      if (isVersionConflict(e)) setStale(true);
      else message.error(e.message);
      return;
    }
    const unplaced = applyApiFieldErrors(form, e, formFieldPath);
    if (unplaced === null) return message.error(e.message);
    const fields = e.fieldErrors();
    setServerIssues(unplaced);
    const failing = markErrors();
    const first = fields.map((f) => stepOfField(formFieldPath(f.name)))[0];
    if (first !== undefined) setStep(first);
    message.error(failing.size ? 'Some fields need attention' : e.message);
  };

  const submit = async () => {
    setServerIssues([]);
    try {
      await form.validateFields({ recursive: true });
    } catch {
      const failing = markErrors();
      if (failing.size) setStep(Math.min(...failing));
      return;
    }
    setStepErrors(new Set());
    const { input, missing } = draftToInput(form.getFieldsValue(true) as MoveDraft);
    if (!input) {
      setServerIssues(missing.map((m) => `${m} is missing`));
      return;
    }
    if (move) {
      // send only what changed, so that an unchanged plan is not taken for a new one
      const baseline = draftToInput(moveToDraft(move)).input as MoveInput | null;
      const changes: Partial<MoveInput> = {};
      for (const k of Object.keys(input) as (keyof MoveInput)[]) {
        if (!baseline || JSON.stringify(input[k]) !== JSON.stringify(baseline[k])) (changes as Record<string, unknown>)[k] = input[k];
      }
      if (move.customerRef && !input.customerRef) changes.customerRef = '';
      if (move.notes && !input.notes) changes.notes = '';
      if (Object.keys(changes).length === 0) {
        message.info('Nothing changed');
        navigate(to.move(move.id));
        return;
      }
      update.mutate(
        { id: move.id, version: loadedVersion.current ?? move.version, ...changes },
        {
          onSuccess: (m) => {
            message.success(`${m.reference} saved`);
            navigate(to.move(m.id));
          },
          onError: handleApiError,
        },
      );
    } else {
      create.mutate(input, {
        onSuccess: (m) => {
          message.success(`${m.reference} opened`);
          navigate(to.move(m.id));
        },
        onError: handleApiError,
      });
    }
  };

  const anchorOptions = (trailer?.anchorPoints ?? []).map((a) => ({ value: a.kind, label: `${ANCHOR_KIND_LABELS[a.kind]} (${formatPounds(a.wllLb)} each)` }));
  const today = dayjs().startOf('day');

  const show = (i: number): React.CSSProperties => (i === step ? {} : { display: 'none' });

  return (
    <Row gutter={[24, 16]}>
      <Col xs={24} xl={13}>
        {stale && (
          <Alert
            type="error"
            showIcon
            style={{ marginBottom: 12 }}
            data-testid="stale-edit"
            title="Someone else changed this move after you opened it"
            description="Nothing was saved. Reload the move to see the current version, then make your changes again."
            action={
              <Button size="small" onClick={() => window.location.reload()}>
                Reload
              </Button>
            }
          />
        )}
        <Steps
          current={step}
          onChange={setStep}
          size="small"
          items={STEPS.map((title, i) => ({ title, status: stepErrors.has(i) ? 'error' : undefined }))}
          style={{ marginBottom: 16 }}
          data-testid="move-steps"
        />
        <Form<MoveDraft>
          form={form}
          layout="vertical"
          initialValues={{ articles: [newArticle(1)], route: [newSegment()], travelDays: 1, sliderSettingFt: null }}
          scrollToFirstError
          data-testid="move-form"
        >
          {/* 1. customer and commodity */}
          <div style={show(0)}>
            <Form.Item name="customer" label="Customer" rules={[{ required: true, whitespace: true, message: 'Name the customer' }, { max: 120 }]}>
              <Input data-testid="f-customer" />
            </Form.Item>
            <Form.Item name="customerRef" label="Customer's reference" rules={[{ max: 60 }]}>
              <Input placeholder="PO or job number" />
            </Form.Item>
            <Form.Item name="commodity" label="Commodity" rules={[{ required: true, whitespace: true, message: 'Say what is hauled' }, { max: 200 }]}>
              <Input data-testid="f-commodity" />
            </Form.Item>
            <Form.Item name="notes" label="Notes" rules={[{ max: 2000 }]}>
              <Input.TextArea rows={3} />
            </Form.Item>
          </div>

          {/* 2. load pieces */}
          <div style={show(1)}>
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

          {/* 3. equipment and placement */}
          <div style={show(2)}>
            <Row gutter={12}>
              <Col xs={24} sm={12}>
                <Form.Item name="tractorId" label="Tractor" rules={[{ required: true, message: 'Pick a tractor' }]}>
                  <Select
                    loading={tractors.isPending}
                    showSearch={{ optionFilterProp: 'label' }}
                    options={(tractors.data ?? []).filter((t) => t.active).map((t) => ({ value: t.id, label: `${t.unitNumber} · ${t.plate}` }))}
                    data-testid="f-tractor"
                  />
                </Form.Item>
              </Col>
              <Col xs={24} sm={12}>
                <Form.Item name="trailerId" label="Trailer" rules={[{ required: true, message: 'Pick a trailer' }]}>
                  <Select
                    loading={trailers.isPending}
                    showSearch={{ optionFilterProp: 'label' }}
                    onChange={onTrailerChange}
                    options={(trailers.data ?? []).filter((t) => t.active).map((t) => ({ value: t.id, label: `${t.unitNumber} · ${TRAILER_TYPE_LABELS[t.type]} ${formatFeetInches(t.lengthIn)}` }))}
                    data-testid="f-trailer"
                  />
                </Form.Item>
              </Col>
            </Row>
            {trailer && (
              <Typography.Paragraph type="secondary" style={{ fontSize: 12 }}>
                Decks: {trailer.decks.map((d) => `${d.name} ${formatFeetInches(d.fromFrontIn)}–${formatFeetInches(d.toFrontIn)} from the front at ${formatFeetInches(d.heightIn)}`).join('; ')}. Deck width {formatFeetInches(trailer.widthIn)}.
              </Typography.Paragraph>
            )}
            {(values.articles ?? []).map((a, i) => {
              const p = pieces.find((x) => x.id === (a.id?.trim() || `piece ${i + 1}`));
              const deck =
                p && trailer
                  ? trailer.decks.filter((d) => d.fromFrontIn < p.positionFromTrailerFrontIn + p.lengthIn && d.toFrontIn > p.positionFromTrailerFrontIn).sort((x, y) => y.heightIn - x.heightIn)[0]
                  : undefined;
              return (
                <Card key={i} size="small" title={`Placement of ${a.id || `piece ${i + 1}`}`} style={{ marginBottom: 12 }}>
                  <Row gutter={12}>
                    <Col xs={24} sm={10}>
                      <Form.Item
                        name={['articles', i, 'position']}
                        label="Front of the piece behind the trailer front"
                        rules={[feetInchesRule('position', { signed: true, positive: false })]}
                        extra={deck ? `rests on the ${deck.name} (${formatFeetInches(deck.heightIn)})` : 'a leading minus puts it ahead of the trailer'}
                      >
                        <Input placeholder={`ft' in"`} data-testid={`f-piece-${i}-position`} />
                      </Form.Item>
                    </Col>
                    <Col xs={12} sm={7}>
                      <Form.Item name={['articles', i, 'lateralOffsetIn']} label="Lateral offset" extra="+ toward the curb side" rules={[{ type: 'number', min: -120, max: 120 }]}>
                        <InputNumber style={{ width: '100%' }} suffix="in" />
                      </Form.Item>
                    </Col>
                    <Col xs={12} sm={7}>
                      <Form.Item name={['articles', i, 'dunnageIn']} label="Dunnage" rules={[{ type: 'number', min: 0, max: 48 }]}>
                        <InputNumber style={{ width: '100%' }} suffix="in" min={0} />
                      </Form.Item>
                    </Col>
                  </Row>
                </Card>
              );
            })}
            {trailer?.slider ? (
              <Card size="small" title="Sliding axle" data-testid="slider-card">
                <Form.Item name="sliderSettingFt" label="Trailer axle group behind the kingpin (ft)">
                  <Slider
                    min={trailer.slider.minFromKingpinFt}
                    max={trailer.slider.maxFromKingpinFt}
                    step={trailer.slider.holeSpacingIn / 12}
                    marks={{ [trailer.slider.minFromKingpinFt]: `${trailer.slider.minFromKingpinFt} ft`, [trailer.slider.maxFromKingpinFt]: `${trailer.slider.maxFromKingpinFt} ft` }}
                    tooltip={{ formatter: (v) => `${Number(v).toFixed(2).replace(/\.?0+$/, '')} ft` }}
                    data-testid="f-slider"
                  />
                </Form.Item>
                {instant && (
                  <div data-testid="slider-readout">
                    Setting {instant.settingFt.toFixed(2).replace(/\.?0+$/, '')} ft: steer {formatPounds(Math.max(0, instant.steerLb))}, drive {formatPounds(Math.max(0, instant.driveLb))}, trailer group{' '}
                    {formatPounds(Math.max(0, instant.trailerLb))}
                  </div>
                )}
                {instant?.suggestion && (
                  <Alert
                    style={{ marginTop: 8 }}
                    type={instant.suggestion.found ? 'info' : 'warning'}
                    showIcon
                    data-testid="slider-suggestion"
                    title={instant.suggestion.found ? `Suggested: ${instant.suggestion.best!.axleGroupFromKingpinFt} ft` : 'No legal setting'}
                    description={instant.suggestion.message}
                    action={
                      instant.suggestion.found && (
                        <Button size="small" onClick={() => form.setFieldValue('sliderSettingFt', instant.suggestion!.best!.axleGroupFromKingpinFt)} data-testid="use-suggestion">
                          Use it
                        </Button>
                      )
                    }
                  />
                )}
              </Card>
            ) : (
              trailer && (
                <Typography.Paragraph type="secondary">
                  This trailer's axles do not slide: the group sits {trailer.axleGroupFromKingpinFt} ft behind the kingpin.
                </Typography.Paragraph>
              )
            )}
          </div>

          {/* 4. tiedowns per piece */}
          <div style={show(3)}>
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

          {/* 5. route, dates, driver */}
          <div style={show(4)}>
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
        </Form>

        {serverIssues.length > 0 && (
          <Alert
            type="error"
            showIcon
            style={{ marginBottom: 12 }}
            title="Not saved"
            data-testid="form-issues"
            description={
              <ul style={{ margin: 0, paddingLeft: 18 }}>
                {serverIssues.map((s) => (
                  <li key={s}>{s}</li>
                ))}
              </ul>
            }
          />
        )}
        <Space style={{ width: '100%', justifyContent: 'space-between', marginTop: 8 }} wrap>
          <Button disabled={step === 0} onClick={() => setStep((s) => s - 1)} data-testid="step-back">
            Back
          </Button>
          <Space wrap>
            <Button onClick={() => navigate(move ? to.move(move.id) : '/moves')}>Cancel</Button>
            {step < STEPS.length - 1 && (
              <Button type={step < STEPS.length - 1 ? 'primary' : 'default'} onClick={() => setStep((s) => s + 1)} data-testid="step-next">
                Next
              </Button>
            )}
            {(step === STEPS.length - 1 || move) && (
              <Button type="primary" onClick={submit} loading={create.isPending || update.isPending} disabled={stale} data-testid="save-move">
                {move ? 'Save changes' : 'Open the move'}
              </Button>
            )}
          </Space>
        </Space>
      </Col>
      <Col xs={24} xl={11}>
        <div style={{ position: 'sticky', top: 16 }}>
          <LiveFeedback
            instant={instant}
            tractor={tractor}
            trailer={trailer}
            articles={pieces}
            sliderSettingFt={values.sliderSettingFt}
            missing={conversion.missing}
            preview={{ data: preview.data, isFetching: preview.isFetching, error: preview.error, stale: previewStale }}
          />
        </div>
      </Col>
    </Row>
  );
}
