import { useState } from 'react';
import { Alert, App, Button, Input, Modal, Space } from 'antd';
import { MOVE_STAGE_LABELS, MOVE_TRANSITIONS, type MoveDto, type MoveStage, type UnmetCondition } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { useChangeStage } from '../api/change-stage';

const NEXT_LABELS: Partial<Record<MoveStage, string>> = {
  permits_received: 'Mark permits received',
  escorts_booked: 'Mark escorts booked',
  running: 'Start the run',
  delivered: 'Mark delivered',
};

/** Buttons for the stages the workflow allows next; the server checks the guards and lists what is unmet. */
export function StageControl({ move }: { move: MoveDto }) {
  const { message } = App.useApp();
  const change = useChangeStage();
  const [unmet, setUnmet] = useState<{ to: MoveStage; items: UnmetCondition[]; text: string } | null>(null);
  const [cancelOpen, setCancelOpen] = useState(false);
  const [reason, setReason] = useState('');
  const next = MOVE_TRANSITIONS[move.stage].filter((s) => s !== 'cancelled');
  const canCancel = MOVE_TRANSITIONS[move.stage].includes('cancelled');

  const go = (to: MoveStage, why?: string) =>
    change.mutate(
      { id: move.id, to, version: move.version, ...(why ? { reason: why } : {}) },
      {
        onSuccess: (m) => {
          setUnmet(null);
          setCancelOpen(false);
          setReason('');
          message.success(`${m.reference} is now ${MOVE_STAGE_LABELS[m.stage].toLowerCase()}`);
        },
        onError: (e) => {
          if (e instanceof ApiError && e.status === 409) {
            const details = e.body.details as { unmet?: UnmetCondition[] } | undefined;
            setUnmet({ to, items: details?.unmet ?? [], text: e.message });
            setCancelOpen(false);
          } else message.error(e.message);
        },
      },
    );

  if (next.length === 0 && !canCancel) return null;
  return (
    <div data-testid="stage-control">
      <Space wrap>
        {next.map((s) => (
          <Button key={s} type="primary" loading={change.isPending && change.variables?.to === s} onClick={() => go(s)} data-testid={`stage-to-${s}`}>
            {NEXT_LABELS[s] ?? MOVE_STAGE_LABELS[s]}
          </Button>
        ))}
        {canCancel && (
          <Button danger onClick={() => setCancelOpen(true)} data-testid="stage-cancel">
            Cancel move
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
        open={cancelOpen}
        title={`Cancel ${move.reference}`}
        okText="Cancel the move"
        okButtonProps={{ danger: true, disabled: !reason.trim(), loading: change.isPending }}
        cancelText="Keep it"
        onOk={() => go('cancelled', reason.trim())}
        onCancel={() => setCancelOpen(false)}
      >
        <p>Say why; the reason goes into the move's history.</p>
        <Input.TextArea rows={3} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} data-testid="cancel-reason" />
      </Modal>
    </div>
  );
}
