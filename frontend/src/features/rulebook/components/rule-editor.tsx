import { useEffect, useMemo, useState } from 'react';
import { Alert, App, Button, Drawer, Input, Space, Typography } from 'antd';
import { validateJurisdictionRule, type JurisdictionRule } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { useUpdateRule } from '../api/update-rule';

/** Edits a jurisdiction's record as JSON; saving creates a new version and keeps the old ones. */
export function RuleEditor({ open, code, record, onClose }: { open: boolean; code: string; record: JurisdictionRule; onClose: () => void }) {
  const { message } = App.useApp();
  const [text, setText] = useState('');
  const [note, setNote] = useState('');
  const [serverError, setServerError] = useState<string[]>([]);
  const update = useUpdateRule();
  useEffect(() => {
    if (open) {
      setText(JSON.stringify(record, null, 2));
      setNote('');
      setServerError([]);
    }
  }, [open, record]);

  const check = useMemo((): { record: JurisdictionRule | null; error: string | null } => {
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch (e) {
      return { record: null, error: `Not valid JSON: ${(e as Error).message}` };
    }
    try {
      const r = validateJurisdictionRule(parsed);
      if (r.code !== code) return { record: null, error: `rule.code must stay ${code}` };
      return { record: r, error: null };
    } catch (e) {
      return { record: null, error: (e as Error).message };
    }
  }, [text, code]);

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
      size="large"
      title={`Edit the ${code} record`}
      extra={
        <Button type="primary" onClick={save} disabled={!check.record || !note.trim()} loading={update.isPending} data-testid="save-rule">
          Save as a new version
        </Button>
      }
    >
      <Space orientation="vertical" style={{ width: '100%' }}>
        <Typography.Paragraph type="secondary">
          Every part carries a <code>source</code> with its <code>citation</code> and <code>asOf</code> date; set <code>sample: true</code> on anything not read in a published
          source. Assessments keep the version they used.
        </Typography.Paragraph>
        <Input placeholder="What changed and why (required)" value={note} onChange={(e) => setNote(e.target.value)} maxLength={500} data-testid="rule-note" />
        {check.error ? <Alert type="error" showIcon title={check.error} /> : <Alert type="success" showIcon title="The record is well formed" />}
        {serverError.length > 0 && <Alert type="error" showIcon title="Not saved" description={serverError.join('; ')} />}
        <Input.TextArea value={text} onChange={(e) => setText(e.target.value)} autoSize={{ minRows: 20, maxRows: 40 }} spellCheck={false} style={{ fontFamily: 'ui-monospace, monospace', fontSize: 12 }} data-testid="rule-json" />
      </Space>
    </Drawer>
  );
}
