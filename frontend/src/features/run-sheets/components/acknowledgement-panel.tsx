import { useState } from 'react';
import { Alert, App, Button, Typography } from 'antd';
import { useQueryClient } from '@tanstack/react-query';
import type { RunSheetDto } from '@amberline/common';
import { isRunSheetChanged } from '../../../lib/api-client';
import { useAcknowledgeRunSheet } from '../api/acknowledge-run-sheet';
import { INFO_STYLE, SUCCESS_STYLE } from './section';
import { runSheetKeys } from '../api/keys';

/** Where the acknowledgement stands, and (for the driver) the button that acknowledges this version of the sheet. */
export function AcknowledgementPanel({ sheet, canAcknowledge }: { sheet: RunSheetDto; canAcknowledge: boolean }) {
  const { message } = App.useApp();
  const qc = useQueryClient();
  const ack = useAcknowledgeRunSheet();
  const [changed, setChanged] = useState<string | null>(null);
  const a = sheet.acknowledgement;
  const checks = sheet.latestChecks;
  const checksCurrent = !!checks && checks.fingerprint === sheet.fingerprint;
  const ready = checksCurrent && checks.outcome === 'passed';

  const onAcknowledge = async () => {
    try {
      await ack.mutateAsync({ moveId: sheet.move.id, fingerprint: sheet.fingerprint });
      setChanged(null);
      message.success('Run sheet acknowledged.');
    } catch (e) {
      if (isRunSheetChanged(e)) setChanged((e as Error).message);
      else message.error(e instanceof Error ? e.message : 'The acknowledgement could not be sent.');
    }
  };
  const reload = async () => {
    setChanged(null);
    await qc.invalidateQueries({ queryKey: runSheetKeys.one(sheet.move.id) });
    window.scrollTo({ top: 0 });
  };

  return (
    <div data-testid="acknowledgement">
      {a?.current ? (
        <Alert type="success" showIcon style={SUCCESS_STYLE} data-testid="ack-state" data-state="current" title={<strong>Acknowledged</strong>} description={`You acknowledged this version on ${new Date(a.at).toLocaleString('en-US')}.`} />
      ) : a ? (
        <Alert
          type="warning"
          showIcon
          data-testid="ack-state"
          data-state="outdated"
          title={<strong>Needs a new acknowledgement</strong>}
          description={`The sheet changed after the acknowledgement of ${new Date(a.at).toLocaleString('en-US')}: read it again, check again and acknowledge the new version.`}
        />
      ) : (
        <Alert type="info" showIcon style={INFO_STYLE} data-testid="ack-state" data-state="none" title="Not acknowledged yet" description="The move cannot start until the driver has passed the departure checks and acknowledged this sheet." />
      )}
      {changed && (
        <Alert
          type="error"
          showIcon
          style={{ marginTop: 8 }}
          data-testid="ack-changed"
          title={<strong>This run sheet changed since you opened it</strong>}
          description={
            <>
              <div>{changed}</div>
              <Button style={{ marginTop: 6 }} onClick={reload} data-testid="reload-sheet">
                Reload and read again
              </Button>
            </>
          }
        />
      )}
      {canAcknowledge && !a?.current && (
        <div className="no-print" style={{ marginTop: 10 }}>
          {!ready && (
            <Typography.Paragraph type="secondary" style={{ fontSize: 13 }}>
              {!checksCurrent ? 'Record the departure checks above first.' : 'The last checks blocked departure: fix the problem and check again.'}
            </Typography.Paragraph>
          )}
          <Button type="primary" size="large" block disabled={!ready} loading={ack.isPending} onClick={onAcknowledge} data-testid="acknowledge">
            I have read this run sheet
          </Button>
        </div>
      )}
    </div>
  );
}
