import { useState } from 'react';
import { Alert, App, Button, Input, Modal, Typography } from 'antd';
import { GAUGE_CAUTION, type DepartureChecksDto } from '@amberline/common';
import { useOverrideDepartureChecks } from '../api/override-departure-checks';
import { ftIn, lb } from '../format';
import { SUCCESS_STYLE } from './section';

/** The outcome of a departure check, said plainly: blocked in red with what to do, findings, the gauge estimate. */
export function ChecksResult({ checks, stale, moveId, canOverride }: { checks: DepartureChecksDto; stale?: boolean; moveId?: string; canOverride?: boolean }) {
  const blocking = checks.findings.filter((f) => f.blocking);
  const onlyGauge = blocking.length > 0 && blocking.every((f) => f.code === 'gauge_differs');
  const notes = checks.findings.filter((f) => !f.blocking);
  return (
    <div data-testid="checks-result" data-outcome={checks.outcome}>
      {stale && (
        <Alert type="warning" showIcon style={{ marginBottom: 8 }} title="These checks were taken on an earlier version of this run sheet: take them again." data-testid="checks-stale" />
      )}
      {checks.outcome === 'blocked' ? (
        <Alert
          type="error"
          showIcon
          data-testid="checks-blocked"
          title={<strong>Do not depart; your dispatcher has been told.</strong>}
          description={
            <ul style={{ margin: 0, paddingInlineStart: 18 }}>
              {blocking.map((f) => (
                <li key={f.code + f.message}>{f.message}</li>
              ))}
            </ul>
          }
        />
      ) : (
        <Alert type="success" showIcon style={SUCCESS_STYLE} data-testid="checks-passed" title={<strong>Checks passed</strong>} description="Nothing found that blocks departure. Read the sheet through and acknowledge it below." />
      )}
      {checks.outcome === 'blocked' && onlyGauge && canOverride && moveId && !stale && <OverrideGauge moveId={moveId} checksId={checks.id} />}
      {checks.override && (
        <Alert
          type="info"
          showIcon
          style={{ marginTop: 8 }}
          data-testid="checks-override"
          title={`Gauge finding overridden by ${checks.override.by.name || 'the dispatcher'}, ${new Date(checks.override.at).toLocaleString('en-US', { timeZoneName: 'short' })}`}
          description={checks.override.reason}
        />
      )}
      {notes.length > 0 && (
        <Alert
          type="warning"
          showIcon
          style={{ marginTop: 8 }}
          title="Also noted"
          description={
            <ul style={{ margin: 0, paddingInlineStart: 18 }}>
              {notes.map((f) => (
                <li key={f.code + f.message}>{f.message}</li>
              ))}
            </ul>
          }
        />
      )}
      <Typography.Paragraph style={{ fontSize: 13, margin: '8px 0 0' }}>
        Measured {ftIn(checks.measuredHeightIn)} high, {ftIn(checks.measuredWidthIn)} wide, {ftIn(checks.measuredLengthIn)} long · {checks.driver.name || 'driver'},{' '}
        {new Date(checks.submittedAt).toLocaleString('en-US', { timeZoneName: 'short' })}
      </Typography.Paragraph>
      {checks.gaugeEstimates.map((g, i) => (
        <div key={i} style={{ marginTop: 8, padding: 8, background: '#f8fafc', border: '1px solid #e2e8f0', borderRadius: 4, fontSize: 13 }} data-testid="gauge-estimate">
          <div>
            Trailer group from the gauge ({checks.gaugeReadings[i]?.psi ?? '—'} psi): about <strong>{lb(g.loadLb)}</strong>; planned {lb(g.plannedLb)} (
            {g.loadLb >= g.plannedLb ? `${lb(g.loadLb - g.plannedLb)} more` : `${lb(g.plannedLb - g.loadLb)} less`})
          </div>
          {!g.inCalibratedRange && <div style={{ color: '#b45309' }}>The reading is outside the trailer&apos;s calibrated range.</div>}
          {g.warnings.map((w) => (
            <div key={w} style={{ color: '#b45309' }}>
              {w}
            </div>
          ))}
          <Typography.Text strong type="warning">
            {GAUGE_CAUTION.replace('Estimate only: verify', 'Estimate only — verify')}
          </Typography.Text>
        </div>
      ))}
    </div>
  );
}

/** The dispatcher's override of a gauge finding: only with a reason, recorded in the move's history. */
function OverrideGauge({ moveId, checksId }: { moveId: string; checksId: string }) {
  const { message } = App.useApp();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const override = useOverrideDepartureChecks();
  return (
    <>
      <Button style={{ marginTop: 8 }} onClick={() => setOpen(true)} data-testid="override-gauge">
        Override the gauge finding
      </Button>
      <Modal
        open={open}
        title="Let these checks pass despite the gauge estimate?"
        okText="Override with this reason"
        okButtonProps={{ disabled: reason.trim().length < 3, loading: override.isPending }}
        onCancel={() => setOpen(false)}
        onOk={() =>
          override.mutate(
            { moveId, checksId, reason: reason.trim() },
            { onSuccess: () => (setOpen(false), message.success('Override recorded')), onError: (e) => message.error(e.message) },
          )
        }
      >
        <Typography.Paragraph>Only when you know the weights another way (a scale ticket, the shipper&apos;s weighed figures). Say how; the reason goes into the move&apos;s history with your name.</Typography.Paragraph>
        <Input.TextArea rows={3} maxLength={500} value={reason} onChange={(e) => setReason(e.target.value)} aria-label="Reason" data-testid="override-reason" />
      </Modal>
    </>
  );
}
