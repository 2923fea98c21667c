import { useState } from 'react';
import { Alert, Button, Result, Tag, Typography } from 'antd';
import { Link, useParams } from 'react-router-dom';
import { PageSpinner } from '../../../components/page-spinner';
import { paths } from '../../../config/paths';
import { useRunSheet } from '../../../features/run-sheets/api/get-run-sheet';
import { AcknowledgementPanel } from '../../../features/run-sheets/components/acknowledgement-panel';
import { AxlesSection } from '../../../features/run-sheets/components/axles-section';
import { CautionsBox } from '../../../features/run-sheets/components/cautions-box';
import { ChecksResult } from '../../../features/run-sheets/components/checks-result';
import { DepartureChecksForm } from '../../../features/run-sheets/components/departure-checks-form';
import { NotOnFile, OpenQuestions } from '../../../components/rule-source';
import { EscortsSection } from '../../../features/run-sheets/components/escorts-section';
import { MarkingsList } from '../../../features/run-sheets/components/markings-list';
import { PermitsSection } from '../../../features/run-sheets/components/permits-section';
import { PrintPdfButton } from '../../../features/run-sheets/components/print-pdf-button';
import { RouteSection } from '../../../features/run-sheets/components/route-section';
import { RunSheetDiagram } from '../../../features/run-sheets/components/run-sheet-diagram';
import { RunSheetHeader } from '../../../features/run-sheets/components/run-sheet-header';
import { INFO_STYLE, Section } from '../../../features/run-sheets/components/section';
import type { RunSheetDto } from '@amberline/common';
import { SecurementSection } from '../../../features/run-sheets/components/securement-section';
import { TravelTimeline } from '../../../features/run-sheets/components/travel-timeline';
import { ftIn } from '../../../features/run-sheets/format';
import { ApiError } from '../../../lib/api-client';
import { useAuth } from '../../../lib/auth';

const JUMPS: [string, string][] = [
  ['route', 'Route'],
  ['windows', 'Travel windows'],
  ['permits', 'Permits'],
  ['escorts', 'Escorts'],
  ['load', 'Load'],
  ['securement', 'Securement'],
  ['weights', 'Weights'],
  ['checks', 'Checks'],
];

// Paper: no navigation, forms or buttons, and sections kept whole where they fit.
const PRINT_CSS = `
@media print {
  body { background: #fff; }
  .ant-layout, .ant-layout-content { background: #fff !important; padding: 0 !important; }
  .run-sheet-section { break-inside: avoid; box-shadow: none !important; }
  .run-sheet-page { max-width: none !important; }
  a[href^="tel:"] { color: inherit; text-decoration: none; }
}`;

/** Where departure stands, at the top of the sheet: the checks and the acknowledgement. */
function DepartureStatus({ sheet }: { sheet: RunSheetDto }) {
  const c = sheet.latestChecks;
  const current = !!c && c.fingerprint === sheet.fingerprint;
  const a = sheet.acknowledgement;
  const jump = () => document.getElementById('checks')?.scrollIntoView({ behavior: 'smooth' });
  if (current && c.outcome === 'blocked') {
    return (
      <Alert
        type="error"
        showIcon
        style={{ marginBottom: 12 }}
        data-testid="departure-status"
        title={<strong>Do not depart; your dispatcher has been told.</strong>}
        description={c.findings.filter((f) => f.blocking).map((f) => f.message).join('; ')}
      />
    );
  }
  return (
    <div style={{ display: 'flex', gap: 6, flexWrap: 'wrap', alignItems: 'center', marginBottom: 12, fontSize: 13 }} data-testid="departure-status">
      <span>Departure checks</span>
      <Tag color={current ? 'green' : 'default'} onClick={jump} style={{ cursor: 'pointer' }}>
        {current ? 'passed' : c ? 'to take again' : 'not recorded'}
      </Tag>
      <span>Acknowledgement</span>
      <Tag color={a?.current ? 'green' : a ? 'orange' : 'default'} onClick={jump} style={{ cursor: 'pointer' }}>
        {a?.current ? 'current' : a ? 'needs a new one' : 'not yet'}
      </Tag>
    </div>
  );
}

/** The driver's read-only brief for one move; the driver's only writes are the departure checks and the acknowledgement. */
export function RunSheetPage() {
  const { moveId } = useParams<{ moveId: string }>();
  const { user } = useAuth();
  const q = useRunSheet(moveId);
  const [checkAgain, setCheckAgain] = useState(false);
  if (q.isPending) return <PageSpinner />;
  if (q.error || !q.data) {
    const e = q.error;
    const status = e instanceof ApiError ? e.status : 0;
    return (
      <Result
        status={status === 403 ? '403' : status === 404 ? '404' : 'error'}
        title={status === 403 ? 'This move is not assigned to you' : status === 404 ? 'No such move' : 'The run sheet could not be loaded'}
        subTitle={e?.message}
        extra={<Link to={paths.runSheets}>Back to run sheets</Link>}
      />
    );
  }
  const sheet = q.data;
  const isDriver = user?.role === 'driver';
  const checksOpen = sheet.move.stage === 'permits_received' || sheet.move.stage === 'escorts_booked';
  const latest = sheet.latestChecks;
  const latestStale = !!latest && latest.fingerprint !== sheet.fingerprint;
  const d = sheet.dimensions;

  return (
    <div className="run-sheet-page" style={{ maxWidth: 860, margin: '0 auto' }} data-testid="run-sheet-page">
      <style>{PRINT_CSS}</style>
      <div className="no-print" style={{ display: 'flex', justifyContent: 'space-between', alignItems: 'center', marginBottom: 8, gap: 8 }}>
        <Link to={paths.runSheets}>← Run sheets</Link>
        <PrintPdfButton moveId={sheet.move.id} />
      </div>
      <RunSheetHeader sheet={sheet} />
      <DepartureStatus sheet={sheet} />
      <CautionsBox cautions={sheet.cautions} />
      <OpenQuestions questions={sheet.openQuestions} />

      <nav className="no-print" aria-label="Sections" style={{ display: 'flex', gap: 6, overflowX: 'auto', paddingBottom: 6, marginBottom: 8 }}>
        {JUMPS.map(([id, label]) => (
          <Button key={id} size="small" href={`#${id}`} onClick={(e) => (e.preventDefault(), document.getElementById(id)?.scrollIntoView({ behavior: 'smooth' }))}>
            {label}
          </Button>
        ))}
      </nav>

      <Section id="route" title="Route">
        <RouteSection route={sheet.move.route} />
      </Section>
      <Section id="windows" title="Travel windows">
        <TravelTimeline sheet={sheet} />
      </Section>
      <Section id="permits" title="Permits">
        <PermitsSection permits={sheet.permits} />
      </Section>
      <Section id="escorts" title="Escorts">
        {sheet.openQuestions
          .filter((q) => q.topic === 'escorts')
          .map((q) => (
            <div key={q.jurisdiction} style={{ marginBottom: 6 }}>
              <NotOnFile>escorts: not on file for {q.jurisdiction} — check the permit</NotOnFile>
            </div>
          ))}
        <EscortsSection escorts={sheet.escorts} />
      </Section>
      <Section id="load" title="Load, flags, signs and lamps">
        <div style={{ display: 'grid', gridTemplateColumns: 'repeat(auto-fill, minmax(140px, 1fr))', gap: 4, marginBottom: 10, fontSize: 13 }} data-testid="overall-dimensions">
          <span>
            Height <strong>{ftIn(d.heightIn)}</strong>
          </span>
          <span>
            Width <strong>{ftIn(d.widthIn)}</strong>
          </span>
          <span>
            Length <strong>{ftIn(d.lengthIn)}</strong>
          </span>
          <span>
            Front overhang <strong>{ftIn(d.frontOverhangIn)}</strong>
          </span>
          <span>
            Rear overhang <strong>{ftIn(d.rearOverhangIn)}</strong>
          </span>
          <span>
            Beyond the sides <strong>{ftIn(d.sideProjectionLeftIn)}</strong> left, <strong>{ftIn(d.sideProjectionRightIn)}</strong> right
          </span>
        </div>
        <RunSheetDiagram sheet={sheet} />
        <Typography.Title level={5} style={{ marginTop: 8 }}>
          Flags, signs and lamps
        </Typography.Title>
        <MarkingsList markings={sheet.markings} />
      </Section>
      <Section id="securement" title="Securement">
        <SecurementSection sheet={sheet} />
      </Section>
      <Section id="weights" title="Axle weights and sliding axle">
        <AxlesSection sheet={sheet} />
      </Section>
      <Section id="checks" title="Departure checks">
        <Typography.Paragraph style={{ fontSize: 13 }}>
          Checked against the {sheet.checkAgainst.source === 'permit' ? 'permitted' : 'planned'} dimensions: {ftIn(sheet.checkAgainst.heightIn)} high, {ftIn(sheet.checkAgainst.widthIn)}{' '}
          wide, {ftIn(sheet.checkAgainst.lengthIn)} long.
        </Typography.Paragraph>
        {latest && (
          <div style={{ marginBottom: 12 }}>
            <ChecksResult checks={latest} stale={latestStale} moveId={sheet.move.id} canOverride={user?.role === 'dispatcher' || user?.role === 'admin'} />
          </div>
        )}
        {isDriver && checksOpen && (sheet.acknowledgement?.current && !checkAgain ? (
          <Button className="no-print" onClick={() => setCheckAgain(true)} data-testid="check-again">
            Record the checks again
          </Button>
        ) : (
          <div className="no-print">
            {latest && (
              <Typography.Title level={5} style={{ marginTop: 4 }}>
                Check again
              </Typography.Title>
            )}
            <DepartureChecksForm sheet={sheet} />
          </div>
        ))}
        {isDriver && !checksOpen && (
          <Alert type="info" showIcon style={INFO_STYLE} title={`Departure checks are taken before the move runs; this move is ${sheet.move.stage.replace(/_/g, ' ')}.`} />
        )}
        {!isDriver && !latest && <Typography.Text type="secondary">The driver has not recorded departure checks yet.</Typography.Text>}
      </Section>
      <Section id="acknowledgement" title="Acknowledgement">
        <AcknowledgementPanel sheet={sheet} canAcknowledge={isDriver && checksOpen} />
      </Section>
    </div>
  );
}
