import { useEffect, useMemo, useState } from 'react';
import { Alert, App, Button, Checkbox, Collapse, Drawer, Input, InputNumber, Select, Space, Tabs, Typography } from 'antd';
import { COVERAGE_TOPICS, ESCORT_MEASURES, ROAD_TYPES, factsOf, formatFeetInches, validateJurisdictionRule, type EscortRule, type JurisdictionRule, type Measure, type RoadType } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { useUpdateRule } from '../api/update-rule';
import { FACT_LABELS, describeValue } from './fact-labels';

type AnyFact = { status: string; value?: unknown; citation?: string; url?: string; edition?: string; asOf?: string; quote?: string; note?: string };

/** A copy of the record with one fact replaced (paths are `topic` or `topic.key`). */
function withFact(r: JurisdictionRule, path: string, f: AnyFact): JurisdictionRule {
  const next = structuredClone(r) as unknown as Record<string, Record<string, unknown>>;
  const [a, b] = path.split('.');
  if (b === undefined) (next as Record<string, unknown>)[a] = f;
  else next[a] = { ...next[a], [b]: f };
  return next as unknown as JurisdictionRule;
}

const NUMERIC = /(In|Lb|Days|Ft|LbPerInch)$/;
const ESCORT_PATHS = new Set<string>(ESCORT_MEASURES.map((m) => `escorts.${m}`));

/** Escort rules of one measure as rows: "over" / "or more", threshold, road classes, front, rear, height pole. */
function EscortRulesField({ path, rules, onChange }: { path: string; rules: EscortRule[]; onChange: (r: EscortRule[]) => void }) {
  const measure = path.split('.')[1] as Measure;
  const set = (i: number, patch: Partial<EscortRule>) => onChange(rules.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const threshold = (r: EscortRule) => r.when.over ?? r.when.atLeast ?? 0;
  return (
    <div data-testid={`escort-rows-${measure}`}>
      {rules.map((r, i) => (
        <Space key={i} wrap size={6} style={{ display: 'flex', marginBottom: 4 }}>
          <Select
            size="small"
            style={{ width: 96 }}
            value={r.when.over !== undefined ? 'over' : 'atLeast'}
            onChange={(k) => set(i, { when: k === 'over' ? { measure, over: threshold(r) } : { measure, atLeast: threshold(r) } })}
            options={[
              { value: 'over', label: 'over' },
              { value: 'atLeast', label: 'or more' },
            ]}
            aria-label={`${path} rule ${i + 1} comparison`}
          />
          <InputNumber
            size="small"
            min={0}
            value={threshold(r)}
            addonAfter="in"
            style={{ width: 120 }}
            onChange={(v) => set(i, { when: r.when.over !== undefined ? { measure, over: v ?? 0 } : { measure, atLeast: v ?? 0 } })}
            aria-label={`${path} rule ${i + 1} threshold`}
          />
          <Typography.Text type="secondary" style={{ width: 50 }}>
            {formatFeetInches(threshold(r))}
          </Typography.Text>
          <Checkbox.Group
            value={r.roads}
            onChange={(v) => set(i, { roads: v as RoadType[] })}
            options={ROAD_TYPES.map((x) => ({ value: x, label: x }))}
          />
          <InputNumber size="small" min={0} max={10} value={r.front} addonBefore="front" style={{ width: 110 }} onChange={(v) => set(i, { front: v ?? 0 })} />
          <InputNumber size="small" min={0} max={10} value={r.rear} addonBefore="rear" style={{ width: 105 }} onChange={(v) => set(i, { rear: v ?? 0 })} />
          <Checkbox checked={!!r.heightPole} onChange={(e) => set(i, { heightPole: e.target.checked || undefined })}>
            height pole
          </Checkbox>
          <Button size="small" type="link" danger onClick={() => onChange(rules.filter((_, k) => k !== i))}>
            remove
          </Button>
        </Space>
      ))}
      <Button size="small" onClick={() => onChange([...rules, { when: { measure, over: 0 }, roads: [...ROAD_TYPES], front: 1, rear: 0 }])}>
        Add a threshold
      </Button>
    </div>
  );
}

/** One value with its status and the source fields beside it. */
function FactFields({ path, fact, onChange }: { path: string; fact: AnyFact; onChange: (f: AnyFact) => void }) {
  const known = fact.status !== 'unknown';
  const numeric = NUMERIC.test(path) && (typeof fact.value === 'number' || fact.value === undefined);
  const [json, setJson] = useState(() => (fact.value === undefined ? '' : JSON.stringify(fact.value)));
  const [jsonError, setJsonError] = useState<string | null>(null);
  const setStatus = (status: string) => {
    if (status === 'unknown') onChange({ status, note: fact.note ?? 'not on file' });
    else onChange({ ...fact, status, value: fact.value ?? (numeric ? 0 : null), citation: fact.citation ?? '', url: fact.url ?? '', edition: fact.edition ?? '', asOf: fact.asOf ?? new Date().toISOString().slice(0, 10) });
  };
  const set = (k: keyof AnyFact, v: unknown) => onChange({ ...fact, [k]: v === '' ? undefined : v });
  return (
    <div style={{ borderBottom: '1px solid #e2e8f0', padding: '8px 0' }} data-testid={`fact-${path}`}>
      <Space wrap align="start">
        <Typography.Text strong style={{ width: 230, display: 'inline-block' }}>
          {FACT_LABELS[path] ?? path}
        </Typography.Text>
        <Select
          size="small"
          style={{ width: 130 }}
          value={fact.status}
          onChange={setStatus}
          aria-label={`${path} status`}
          options={[
            { value: 'sourced', label: 'sourced' },
            { value: 'secondary', label: 'secondary' },
            { value: 'unknown', label: 'not on file' },
          ]}
        />
        {known &&
          (ESCORT_PATHS.has(path) ? (
            <EscortRulesField path={path} rules={Array.isArray(fact.value) ? (fact.value as EscortRule[]) : []} onChange={(v) => set('value', v)} />
          ) : numeric ? (
            <InputNumber size="small" value={fact.value as number} onChange={(v) => set('value', v ?? undefined)} aria-label={`${path} value`} />
          ) : (
            <Input.TextArea
              size="small"
              style={{ width: 360, fontFamily: 'ui-monospace, monospace', fontSize: 12 }}
              autoSize={{ minRows: 1, maxRows: 6 }}
              value={json}
              aria-label={`${path} value`}
              status={jsonError ? 'error' : undefined}
              onChange={(e) => {
                setJson(e.target.value);
                try {
                  set('value', JSON.parse(e.target.value));
                  setJsonError(null);
                } catch (err) {
                  setJsonError((err as Error).message);
                }
              }}
            />
          ))}
      </Space>
      {known ? (
        <Space wrap style={{ marginTop: 4, marginLeft: 238 }}>
          <Input size="small" style={{ width: 200 }} placeholder="citation (section)" value={fact.citation} onChange={(e) => set('citation', e.target.value)} aria-label={`${path} citation`} />
          <Input size="small" style={{ width: 260 }} placeholder="URL as found" value={fact.url} onChange={(e) => set('url', e.target.value)} aria-label={`${path} url`} />
          <Input size="small" style={{ width: 150 }} placeholder="edition" value={fact.edition} onChange={(e) => set('edition', e.target.value)} aria-label={`${path} edition`} />
          <Input size="small" style={{ width: 110 }} placeholder="read YYYY-MM-DD" value={fact.asOf} onChange={(e) => set('asOf', e.target.value)} aria-label={`${path} as of`} />
          <Input size="small" style={{ width: 360 }} placeholder="the text's words" value={fact.quote} onChange={(e) => set('quote', e.target.value)} aria-label={`${path} quote`} />
        </Space>
      ) : (
        <Input size="small" style={{ width: 520, marginTop: 4, marginLeft: 238 }} placeholder="what was searched" value={fact.note} onChange={(e) => set('note', e.target.value)} aria-label={`${path} note`} />
      )}
      {jsonError && <div style={{ marginLeft: 238, color: '#b91c1c', fontSize: 12 }}>{jsonError}</div>}
      {known && !numeric && !jsonError && fact.value !== undefined && (
        <div style={{ marginLeft: 238, fontSize: 12, color: '#475569' }} data-testid={`fact-reads-${path}`}>
          reads: {describeValue(path, fact.value)}
        </div>
      )}
    </div>
  );
}

/** Edits a jurisdiction's record by topic, a source beside each value; the raw record is the advanced view. */
export function RuleEditor({ open, code, record, onClose }: { open: boolean; code: string; record: JurisdictionRule; onClose: () => void }) {
  const { message } = App.useApp();
  const [draft, setDraft] = useState<JurisdictionRule>(record);
  const [text, setText] = useState('');
  const [tab, setTab] = useState('form');
  /** Bumped when the raw tab hands a record back, so every field starts from it. */
  const [formKey, setFormKey] = useState(0);
  const [note, setNote] = useState('');
  const [serverError, setServerError] = useState<string[]>([]);
  const update = useUpdateRule();
  useEffect(() => {
    if (open) {
      setDraft(record);
      setText(JSON.stringify(record, null, 2));
      setNote('');
      setServerError([]);
      setTab('form');
    }
  }, [open, record]);

  const check = useMemo((): { record: JurisdictionRule | null; error: string | null } => {
    let parsed: unknown = draft;
    if (tab === 'raw') {
      try {
        parsed = JSON.parse(text);
      } catch (e) {
        return { record: null, error: `Not valid JSON: ${(e as Error).message}` };
      }
    }
    try {
      const r = validateJurisdictionRule(parsed);
      if (r.code !== code) return { record: null, error: `rule.code must stay ${code}` };
      return { record: r, error: null };
    } catch (e) {
      return { record: null, error: (e as Error).message };
    }
  }, [draft, text, tab, code]);

  const facts = useMemo(() => new Map(factsOf(draft)), [draft]);
  const switchTab = (k: string) => {
    if (k === 'raw') setText(JSON.stringify(draft, null, 2));
    else {
      try {
        setDraft(JSON.parse(text));
        setFormKey((k) => k + 1);
      } catch {
        /* keep the form's draft when the raw text does not parse */
      }
    }
    setTab(k);
  };

  const save = () => {
    if (!check.record) return;
    update.mutate(
      { code, record: check.record, note: note.trim() },
      {
        onSuccess: (v) => {
          message.success(`${code} saved as version ${v.version}`);
          onClose();
        },
        onError: (e) => setServerError(e instanceof ApiError && e.fieldErrors().length ? e.fieldErrors().map((f) => `${f.name}: ${f.errors.join(', ')}`) : [e.message]),
      },
    );
  };

  return (
    <Drawer
      open={open}
      onClose={onClose}
      size={1100}
      title={`Edit the ${code} record`}
      extra={
        <Button type="primary" onClick={save} disabled={!check.record || !note.trim()} loading={update.isPending} data-testid="save-rule">
          Save as a new version
        </Button>
      }
    >
      <Space orientation="vertical" style={{ width: '100%' }}>
        <Typography.Paragraph type="secondary">
          Every value is sourced (the state&apos;s statute, code or DOT / state-patrol permit documents), secondary (a federal or university summary) or not on file (no value; say
          what was searched). Never fill a value from memory, another state or a default. Assessments keep the version they used.
        </Typography.Paragraph>
        <Input placeholder="What changed and why (required)" value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} data-testid="rule-note" />
        {check.error ? <Alert type="error" showIcon title={check.error} data-testid="rule-check" /> : <Alert type="success" showIcon title="The record is well formed" data-testid="rule-check" />}
        {serverError.length > 0 && <Alert type="error" showIcon title="Not saved" description={serverError.join('; ')} />}
        <Tabs
          activeKey={tab}
          onChange={switchTab}
          items={[
            {
              key: 'form',
              label: 'By topic',
              children: (
                <Collapse
                  key={formKey}
                  items={COVERAGE_TOPICS.map((t) => ({
                    key: t.key,
                    label: t.label,
                    children: t.paths.map((p) => (
                      <FactFields key={p} path={p} fact={facts.get(p) as AnyFact} onChange={(f) => setDraft((d) => withFact(d, p, f))} />
                    )),
                  }))}
                />
              ),
            },
            {
              key: 'raw',
              label: 'Raw record (advanced)',
              children: (
                <Input.TextArea value={text} onChange={(e) => setText(e.target.value)} autoSize={{ minRows: 20, maxRows: 40 }} spellCheck={false} style={{ fontFamily: 'ui-monospace, monospace', fontSize: 12 }} data-testid="rule-json" />
              ),
            },
          ]}
        />
      </Space>
    </Drawer>
  );
}

