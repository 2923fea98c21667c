import { useState } from 'react';
import { Alert, App, Button, Input, Modal, Space, Typography } from 'antd';
import { MOVE_STAGE_LABELS, MOVE_TRANSITIONS, REOPEN_DELIVERED_DAYS, type MoveDto, type MoveStage, type UnmetCondition } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { useChangeStage } from '../api/change-stage';
import { useReopenMove } from '../api/reopen-move';

const NEXT_LABELS: Partial<Record<MoveStage, string>> = {
  permits_received: 'Mark permits received',
  escorts_booked: 'Mark escorts booked',
  running: 'Start the run',
  delivered: 'Mark delivered',
  cancelled: 'Cancel move',
};

/** What each step means, shown in its confirmation. */
const STEP_NOTES: Partial<Record<MoveStage, string>> = {
  permits_received: 'Every state that needs a permit has it issued, with its PDF, paid, and valid over the planned travel.',
  escorts_booked: 'Every escort position the permits and rules ask for is confirmed by a vendor for the travel days.',
  running: 'The driver has passed the departure checks and acknowledged the current run sheet; the move leaves now.',
  delivered: 'The load has arrived. A delivered move can be reopened for 7 days.',
  cancelled: 'Open permits are voided and escort bookings called off. A cancelled move can be reopened.',
};

type Pending = { kind: 'stage'; to: MoveStage } | { kind: 'reopen' };

/**
 * Buttons for the stages the workflow allows next, and reopening where it is allowed. Every step asks for
 * confirmation and takes a note for the history (a reason is required to cancel or reopen); the server checks
 * the guards and lists what is unmet.
 */
export function StageControl({ move }: { move: MoveDto }) {
  const { message } = App.useApp();
  const change = useChangeStage();
  const reopen = useReopenMove();
  const [unmet, setUnmet] = useState<{ to: MoveStage; items: UnmetCondition[]; text: string } | null>(null);
  const [pending, setPending] = useState<Pending | null>(null);
  const [reason, setReason] = useState('');
  const next = MOVE_TRANSITIONS[move.stage];
  const deliveredAt = move.stage === 'delivered' && move.stageChangedAt ? Date.parse(move.stageChangedAt) : null;
  const canReopen = move.stage === 'cancelled' || (deliveredAt !== null && Date.now() - deliveredAt <= REOPEN_DELIVERED_DAYS * 86_400_000);
  const needsReason = pending?.kind === 'reopen' || (pending?.kind === 'stage' && pending.to === 'cancelled');

  const close = () => {
    setPending(null);
    setReason('');
  };
  const onError = (to: MoveStage) => (e: Error) => {
    if (e instanceof ApiError && e.status === 409) {
      const details = e.body.details as { unmet?: UnmetCondition[] } | undefined;
      setUnmet({ to, items: details?.unmet ?? [], text: e.message });
      close();
    } else message.error(e.message);
  };
  const confirm = () => {
    if (!pending) return;
    const why = reason.trim();
    if (pending.kind === 'reopen') {
      reopen.mutate(
        { id: move.id, version: move.version, reason: why },
        { onSuccess: (m) => (close(), setUnmet(null), message.success(`${m.reference} is reopened: ${MOVE_STAGE_LABELS[m.stage].toLowerCase()}`)), onError: onError(move.stage) },
      );
      return;
    }
    const to = pending.to;
    change.mutate(
      { id: move.id, to, version: move.version, ...(why ? { reason: why } : {}) },
      { onSuccess: (m) => (close(), setUnmet(null), message.success(`${m.reference} is now ${MOVE_STAGE_LABELS[m.stage].toLowerCase()}`)), onError: onError(to) },
    );
  };

  if (next.length === 0 && !canReopen) return null;
  const title = pending?.kind === 'reopen' ? `Reopen ${move.reference}?` : pending ? `${NEXT_LABELS[pending.to] ?? MOVE_STAGE_LABELS[pending.to]}: ${move.reference}?` : '';
  const note =
    pending?.kind === 'reopen'
      ? move.stage === 'cancelled'
        ? 'The move goes back to Requested and is assessed again with the current rules; permits are created anew.'
        : 'The move goes back to Running.'
      : pending
        ? STEP_NOTES[pending.to]
        : '';
  return (
    <div data-testid="stage-control">
      <Space wrap>
        {next
          .filter((s) => s !== 'cancelled')
          .map((s) => (
            <Button key={s} type="primary" onClick={() => setPending({ kind: 'stage', to: s })} data-testid={`stage-to-${s}`}>
              {NEXT_LABELS[s] ?? MOVE_STAGE_LABELS[s]}
            </Button>
          ))}
        {next.includes('cancelled') && (
          <Button danger onClick={() => setPending({ kind: 'stage', to: 'cancelled' })} data-testid="stage-cancel">
            Cancel move
          </Button>
        )}
        {canReopen && (
          <Button onClick={() => setPending({ kind: 'reopen' })} data-testid="stage-reopen">
            Reopen move
          </Button>
        )}
      </Space>
      {unmet && (
        <Alert
          style={{ marginTop: 12 }}
          type="error"
          showIcon
          closable={{ onClose: () => setUnmet(null) }}
          data-testid="unmet-conditions"
          title={unmet.items.length ? `Not yet ready for “${MOVE_STAGE_LABELS[unmet.to]}”:` : unmet.text}
          description={
            unmet.items.length > 0 && (
              <ul style={{ margin: 0, paddingLeft: 18 }}>
                {unmet.items.map((u, i) => (
                  <li key={i}>
                    {u.jurisdiction ? `${u.jurisdiction}: ` : ''}
                    {u.message}
                  </li>
                ))}
              </ul>
            )
          }
        />
      )}
      <Modal
        open={pending !== null}
        title={title}
        okText={pending?.kind === 'reopen' ? 'Reopen the move' : pending?.kind === 'stage' && pending.to === 'cancelled' ? 'Cancel the move' : 'Confirm'}
        okButtonProps={{ danger: pending?.kind === 'stage' && pending.to === 'cancelled', disabled: needsReason && !reason.trim(), loading: change.isPending || reopen.isPending, ...({ 'data-testid': 'stage-confirm' } as object) }}
        cancelText={pending?.kind === 'stage' && pending.to === 'cancelled' ? 'Keep it' : 'Back'}
        onOk={confirm}
        onCancel={close}
        destroyOnHidden
      >
        <Typography.Paragraph>{note}</Typography.Paragraph>
        <Typography.Paragraph type="secondary" style={{ marginBottom: 6 }}>
          {needsReason ? 'Say why; the reason goes into the move’s history with your name.' : 'Note for the history (optional); the step is recorded with your name.'}
        </Typography.Paragraph>
        <Input.TextArea rows={3} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} data-testid="stage-reason" aria-label="Reason" />
      </Modal>
    </div>
  );
}
