import { useState } from 'react';
import { Alert, App, Button, Input, Modal, Spin, Typography } from 'antd';
import type { AssessmentDto, MoveDto } from '@amberline/common';
import { useReassessment } from '../api/get-reassessment';
import { useReassessMove } from '../api/reassess-move';

/**
 * Past requested, a move's assessment keeps the rule versions it used. When the rulebook has moved on, the
 * dispatcher sees which states and may re-assess with the current rules after reading what would change.
 */
export function KeptRules({ move, assessment, canEdit }: { move: MoveDto; assessment: AssessmentDto; canEdit: boolean }) {
  const { message } = App.useApp();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const preview = useReassessment(move.id, open);
  const apply = useReassessMove();
  if (!assessment.pinned) return null;
  const closed = move.stage === 'delivered' || move.stage === 'cancelled';
  if (closed || assessment.newerRules.length === 0) {
    return (
      <Typography.Paragraph type="secondary" style={{ fontSize: 12 }} data-testid="kept-rules">
        {closed
          ? `This ${move.stage} move keeps the rule versions it was assessed with; its assessment never changes.`
          : 'This assessment keeps the rule versions it used when the move left Requested; none has changed since.'}
      </Typography.Paragraph>
    );
  }
  return (
    <>
      <Alert
        type="warning"
        showIcon
        style={{ marginBottom: 12 }}
        data-testid="kept-rules"
        title={`Newer rules exist for ${assessment.newerRules.map((n) => `${n.code} (v${n.used} used, v${n.current} now)`).join(', ')}`}
        description="This assessment keeps the rule versions it used when the move left Requested. Re-assessing shows what would change before anything is applied."
        action={
          canEdit && (
            <Button size="small" onClick={() => setOpen(true)} data-testid="reassess-open">
              Re-assess with current rules
            </Button>
          )
        }
      />
      <Modal
        open={open}
        title={`Re-assess ${move.reference} with the current rules?`}
        okText="Apply the current rules"
        okButtonProps={{ disabled: !preview.data?.allowed, loading: apply.isPending, ...({ 'data-testid': 'reassess-apply' } as object) }}
        cancelText="Keep the versions used"
        onCancel={() => setOpen(false)}
        onOk={() =>
          apply.mutate(
            { id: move.id, version: preview.data?.moveVersion ?? move.version, ...(reason.trim() ? { reason: reason.trim() } : {}) },
            {
              onSuccess: () => {
                setOpen(false);
                setReason('');
                message.success(`${move.reference} is assessed with the current rules`);
              },
              onError: (e) => message.error(e.message),
            },
          )
        }
      >
        {preview.isPending ? (
          <Spin />
        ) : preview.isError ? (
          <Alert type="error" showIcon title={preview.error.message} />
        ) : (
          <div data-testid="reassess-preview">
            <Typography.Paragraph>
              {preview.data.differences.length ? 'What would change:' : 'Nothing the desk acts on would change (permit need, escorts, fee, travel windows, problems).'}
            </Typography.Paragraph>
            {preview.data.differences.length > 0 && (
              <ul style={{ paddingLeft: 18 }}>
                {preview.data.differences.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            )}
            <Typography.Paragraph type="secondary" style={{ marginBottom: 6 }}>
              Permits and the driver’s run sheet follow the new assessment (the driver acknowledges it again).
            </Typography.Paragraph>
            <Input.TextArea rows={2} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} placeholder="Note for the history (optional)" aria-label="Note" />
          </div>
        )}
      </Modal>
    </>
  );
}
