/** The move form in steps, with live feedback beside it. Used for new moves and for editing one. */
import { useEffect, useMemo, useRef, useState } from 'react';
import { Alert, App, Button, Col, Form, Row, Space, Steps } from 'antd';
import { useNavigate } from 'react-router-dom';
import { ANCHOR_KIND_LABELS, formatPounds, type MoveDto, type MoveInput, type TractorDto, type TrailerDto } from '@amberline/common';
import { ApiError, isVersionConflict } from '../../../../lib/api-client';
import { applyApiFieldErrors } from '../../../../components/form-errors';
import { to } from '../../../../config/paths';
import { useCreateMove } from '../../api/create-move';
import { useDrivers } from '../../api/get-drivers';
import { usePreviewMove } from '../../api/preview-move';
import { useUpdateMove } from '../../api/update-move';
import { articleFromDraft, draftToInput, formFieldPath, instantAxles, moveToDraft, newArticle, newSegment, stepOfField, type MoveDraft } from '../../draft';
import { LiveFeedback } from '../live-feedback';
import { CustomerStep } from './customer-step';
import { EquipmentStep } from './equipment-step';
import { changedFields, STEPS, type FleetList } from './options';
import { PiecesStep } from './pieces-step';
import { RouteStep } from './route-step';
import { TiedownsStep } from './tiedowns-step';

/** Debounces a value: the preview goes to the server ~400 ms after the dispatcher stops typing. */
function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

type Props = {
  move?: MoveDto;
  /** The fleet to pick from (the fleet feature's lists, handed in by the page). */
  tractors: FleetList<TractorDto>;
  trailers: FleetList<TrailerDto>;
};

export function MoveForm({ move, tractors, trailers }: Props) {
  const { message } = App.useApp();
  const navigate = useNavigate();
  const [form] = Form.useForm<MoveDraft>();
  const [step, setStep] = useState(0);
  const [stepErrors, setStepErrors] = useState<Set<number>>(new Set());
  const [serverIssues, setServerIssues] = useState<string[]>([]);
  const [stale, setStale] = useState(false);
  const loadedVersion = useRef<number | null>(null);
  const drivers = useDrivers();
  const create = useCreateMove();
  const update = useUpdateMove();

  useEffect(() => {
    if (move && loadedVersion.current === null) {
      form.setFieldsValue(moveToDraft(move));
      loadedVersion.current = move.version;
    }
  }, [move, form]);

  const watched = Form.useWatch([], form) as MoveDraft | undefined;
  const values = useMemo(() => watched ?? ({} as MoveDraft), [watched]);
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
      const changes = changedFields(move, baseline, input);
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
          <CustomerStep hidden={step !== 0} />
          <PiecesStep hidden={step !== 1} values={values} />
          <EquipmentStep
            hidden={step !== 2}
            form={form}
            values={values}
            tractors={tractors}
            trailers={trailers}
            trailer={trailer}
            pieces={pieces}
            instant={instant}
            onTrailerChange={onTrailerChange}
          />
          <TiedownsStep hidden={step !== 3} values={values} trailer={trailer} anchorOptions={anchorOptions} />
          <RouteStep hidden={step !== 4} drivers={drivers} />
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
