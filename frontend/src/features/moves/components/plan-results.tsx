/** The engine's plan-check results in plain words: dimensions, the federal legal check, securement, totals. */
import { Alert, Descriptions, Space, Table, Tag, Typography } from 'antd';
import {
  formatFeetInches,
  formatPounds,
  formatUsd,
  type AxleCheckResult,
  type AxleGroupCheck,
  type PlanCheckResult,
  type Reason,
} from '@amberline/common';
import { CitedSource, NotOnFile } from '../../../components/rule-source';
import { localInstant } from '../../../lib/time';

const ft = (inches: number) => formatFeetInches(Math.max(0, inches));
const lb = (pounds: number) => formatPounds(Math.max(0, pounds));

export function ReasonLine({ r }: { r: Reason }) {
  return (
    <div style={{ marginBottom: 4 }}>
      <div>{r.message}</div>
      <CitedSource text={r.source} />
    </div>
  );
}

export function DimensionsSummary({ result, column }: { result: PlanCheckResult; column?: number }) {
  const d = result.dimensions;
  return (
    <Descriptions
      size="small"
      bordered
      column={column ?? { xs: 1, sm: 2, lg: 3 }}
      data-testid="overall-dimensions"
      items={[
        { key: 'w', label: 'Overall width', children: <span data-testid="overall-width">{ft(d.widthIn)}</span> },
        { key: 'h', label: 'Overall height', children: <span data-testid="overall-height">{ft(d.heightIn)}</span> },
        { key: 'l', label: 'Overall length', children: <span data-testid="overall-length">{ft(d.lengthIn)}</span> },
        { key: 'fo', label: 'Front overhang', children: ft(d.frontOverhangIn) },
        { key: 'ro', label: 'Rear overhang', children: ft(d.rearOverhangIn) },
        { key: 'sp', label: 'Side projection', children: d.sideProjectionIn > 0 ? `${ft(d.sideProjectionLeftIn)} left, ${ft(d.sideProjectionRightIn)} right` : 'none' },
        { key: 'g', label: 'Gross', children: lb(result.axleLoads.grossLb) },
        { key: 'k', label: 'Kingpin load', children: lb(result.axleLoads.kingpinLb) },
      ]}
    />
  );
}

const RULE_LABEL: Record<AxleGroupCheck['rule'], string> = {
  single: 'single axle',
  tandem: 'tandem',
  'bridge-formula': 'bridge formula',
  'two-tandem-exception': 'two tandems (36 ft)',
  gross: 'gross',
};

/** The federal axle check: every violation in words, with the bridge-formula findings called out. */
export function FederalCheck({ check: f }: { check: AxleCheckResult }) {
  const bridge = f.violations.filter((v) => v.rule === 'bridge-formula');
  return (
    <div data-testid="federal-check">
      {f.legal ? (
        <Alert type="success" showIcon title={`Within federal axle, bridge-formula and gross limits (${lb(f.grossLb)} gross)`} style={{ marginBottom: 8 }} />
      ) : (
        <Alert
          type="error"
          showIcon
          title={`Over federal limits on ${f.violations.length} check${f.violations.length === 1 ? '' : 's'}: a weight permit is needed`}
          style={{ marginBottom: 8 }}
        />
      )}
      {bridge.length > 0 && (
        <div data-testid="bridge-findings" style={{ marginBottom: 8 }}>
          <Typography.Text strong>Bridge formula</Typography.Text>
          <ul style={{ margin: '4px 0', paddingLeft: 0, listStyle: 'none' }}>
            {bridge.map((v, i) => (
              <li key={i} data-testid="bridge-finding" style={{ padding: '6px 0', borderBottom: '1px solid #f1f5f9' }}>
                <Space orientation="vertical" size={0}>
                  <span>{v.message}</span>
                  <CitedSource text={v.source} />
                </Space>
              </li>
            ))}
          </ul>
        </div>
      )}
      {f.violations.filter((v) => v.rule !== 'bridge-formula').length > 0 && (
        <div style={{ marginBottom: 8 }}>
          <Typography.Text strong>Other limits exceeded</Typography.Text>
          <ul style={{ margin: '4px 0', paddingLeft: 20 }}>
            {f.violations
              .filter((v) => v.rule !== 'bridge-formula')
              .map((v, i) => (
                <li key={i}>{v.message}</li>
              ))}
          </ul>
        </div>
      )}
      <details>
        <summary style={{ cursor: 'pointer', color: '#475569' }}>Every group checked ({f.groups.length})</summary>
        <Table<AxleGroupCheck>
          size="small"
          rowKey={(g) => `${g.fromAxle}-${g.toAxle}-${g.rule}`}
          dataSource={f.groups}
          pagination={false}
          scroll={{ x: 560 }}
          columns={[
            { title: 'Axles', render: (_, g) => (g.fromAxle === g.toAxle ? `${g.fromAxle}` : `${g.fromAxle}–${g.toAxle}`) },
            { title: 'Rule', render: (_, g) => RULE_LABEL[g.rule] },
            { title: 'Spread', render: (_, g) => (g.distanceFt > 0 ? `${g.distanceFt.toFixed(1)} ft` : '') },
            { title: 'Weight', render: (_, g) => lb(g.weightLb) },
            { title: 'Limit', render: (_, g) => lb(g.limitLb) },
            { title: '', render: (_, g) => (g.ok ? <Tag color="green">ok</Tag> : <Tag color="red">over {lb(g.overByLb)}</Tag>) },
          ]}
        />
      </details>
    </div>
  );
}

/** Securement of every piece: tiedown count and aggregate working load limit against what 49 CFR 393 asks. */
export function SecurementList({ result, names }: { result: PlanCheckResult; names?: Record<string, string> }) {
  return (
    <div data-testid="securement">
      {result.securement.map((s) => (
        <div key={s.articleId} style={{ marginBottom: 12 }} data-testid="securement-piece">
          <Space wrap>
            <Typography.Text strong>{names?.[s.articleId] ? `${s.articleId} · ${names[s.articleId]}` : s.articleId}</Typography.Text>
            {s.ok ? <Tag color="green">securement adequate</Tag> : <Tag color="red">securement falls short</Tag>}
          </Space>
          <div>
            {s.count} of {s.requiredCount} tiedowns required; aggregate credited WLL {lb(s.aggregateLb)} against {lb(s.requiredAggregateLb)} (half the weight)
          </div>
          {s.findings.length > 0 && (
            <ul style={{ margin: '4px 0', paddingLeft: 20 }}>
              {s.findings.map((f, i) => (
                <li key={i}>{f}</li>
              ))}
            </ul>
          )}
          <details>
            <summary style={{ cursor: 'pointer', color: '#475569' }}>Why</summary>
            {s.reasons.map((r, i) => (
              <ReasonLine key={i} r={r} />
            ))}
          </details>
        </div>
      ))}
    </div>
  );
}

/** The whole route at a glance. */
export function AssessmentTotals({ result, column }: { result: PlanCheckResult; column?: number }) {
  const s = result.summary;
  return (
    <div data-testid="assessment-totals">
      <Descriptions
        size="small"
        bordered
        column={column ?? { xs: 1, sm: 2, lg: 3 }}
        items={[
          { key: 'p', label: 'Permits needed', children: s.permitsNeeded.length ? s.permitsNeeded.join(', ') : 'none' },
          {
            key: 'e',
            label: 'Escorts (most at once)',
            children: s.escortsNotOnFile.length ? (
              <span>
                {s.maxEscortsFront + s.maxEscortsRear > 0 ? `at least ${s.maxEscortsFront} front, ${s.maxEscortsRear} rear; ` : ''}
                <NotOnFile>not on file for {s.escortsNotOnFile.join(', ')} — check the permit</NotOnFile>
              </span>
            ) : (
              `${s.maxEscortsFront} front, ${s.maxEscortsRear} rear`
            ),
          },
          {
            key: 'f',
            label: 'Estimated fees',
            children: s.feesNotOnFile.length ? (
              <span>
                {formatUsd(s.estimatedFeesUsd)} on file + <NotOnFile>unknown for {s.feesNotOnFile.join(', ')}</NotOnFile>
              </span>
            ) : (
              formatUsd(s.estimatedFeesUsd)
            ),
          },
          { key: 's', label: 'Superload in', children: s.superloads.length ? s.superloads.join(', ') : 'none' },
          {
            key: 'd',
            label: 'Earliest legal start',
            children: (
              <span>
                {s.earliestDeparture
                  ? `${localInstant(s.earliestDeparture, result.jurisdictions[0]?.travel[0]?.timeZone)} (${result.jurisdictions[0]?.code ?? ''} local time)`
                  : 'no window on the planned dates'}
                {!s.earliestDepartureKnown && (
                  <>
                    {' '}
                    <NotOnFile>travel rules of the first state not on file</NotOnFile>
                  </>
                )}
              </span>
            ),
          },
        ]}
      />
      {s.problems.length > 0 && (
        <Alert
          style={{ marginTop: 8 }}
          type="error"
          showIcon
          title={`${s.problems.length} problem${s.problems.length === 1 ? '' : 's'} to resolve`}
          description={
            <ul style={{ margin: 0, paddingLeft: 18 }} data-testid="plan-problems">
              {s.problems.map((p, i) => (
                <li key={i}>{p}</li>
              ))}
            </ul>
          }
        />
      )}
    </div>
  );
}
