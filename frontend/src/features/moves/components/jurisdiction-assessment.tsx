/** Per-jurisdiction assessment: permit and why, escorts and the rule that asked, markings, travel windows, fee, superload. */
import { Alert, Collapse, Space, Tag, Typography } from 'antd';
import { formatFeetInches, formatUsd, type JurisdictionPlanResult, type PlanCheckResult } from '@amberline/common';
import dayjs from 'dayjs';
import { Link } from 'react-router-dom';
import { CitedSource, NotOnFile, OpenQuestions } from '../../../components/rule-source';
import { to } from '../../../config/paths';
import { ReasonLine } from './plan-results';

const TOPIC_WORDS: Record<string, string> = {
  'travel.hours': 'travel hours',
  'travel.weekends': 'weekends',
  'travel.holidays': 'holidays',
  'travel.curfews': 'curfews',
  escorts: 'escorts',
};

function JurisdictionBody({ j }: { j: JurisdictionPlanResult }) {
  const m = j.markings;
  const g = j.governedBy;
  return (
    <div>
      {g && (g.topics.length > 0 || g.differences.length > 0) && (
        <Alert
          type={g.differences.length ? 'warning' : 'info'}
          showIcon
          style={{ marginBottom: 8 }}
          data-testid="permit-governs"
          title={`The issued ${g.label} governs ${g.topics.map((t) => TOPIC_WORDS[t] ?? t).join(', ')} here`}
          description={
            g.differences.length > 0 && (
              <ul style={{ margin: 0, paddingLeft: 18 }}>
                {g.differences.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            )
          }
        />
      )}
      <Typography.Title level={5} style={{ marginTop: 0 }}>
        Permit
      </Typography.Title>
      <div data-testid="permit-reasons">
        {j.permitReasons.map((r, i) => (
          <ReasonLine key={i} r={r} />
        ))}
      </div>
      <div style={{ fontSize: 12, color: '#475569' }} data-testid="permit-validity">
        Valid {j.permit.validityDays !== null ? `${j.permit.validityDays} days` : <NotOnFile>validity not on file</NotOnFile>}; apply{' '}
        {j.permit.leadTimeDays !== null ? `${j.permit.leadTimeDays} days ahead` : <NotOnFile>lead time not on file</NotOnFile>}
        {(j.permit.validityDays !== null || j.permit.leadTimeDays !== null) && (
          <>
            {' · '}
            <CitedSource text={j.permit.source} />
          </>
        )}
      </div>
      <OpenQuestions questions={j.openQuestions} />

      <Typography.Title level={5}>Escorts</Typography.Title>
      <div data-testid="escort-requirement">
        {!j.escorts.known ? (
          <Space wrap>
            <NotOnFile>
              escorts: not on file for {j.code}
              {j.escorts.unknownMeasures.length ? ` (${j.escorts.unknownMeasures.join(', ')})` : ''} — check the permit
            </NotOnFile>
            {j.escorts.front + j.escorts.rear > 0 && (
              <Tag color="purple" data-testid="escort-count">
                at least {j.escorts.front} front, {j.escorts.rear} rear
              </Tag>
            )}
          </Space>
        ) : j.escorts.front + j.escorts.rear === 0 ? (
          <span>Not required by the rules on file for the road types travelled.</span>
        ) : (
          <Space wrap>
            <Tag color="purple" data-testid="escort-count">
              {j.escorts.front} front, {j.escorts.rear} rear
            </Tag>
            {j.escorts.heightPole && (
              <Tag color="volcano" data-testid="height-pole">
                height pole{j.escorts.heightPoleSetIn ? ` set at ${formatFeetInches(j.escorts.heightPoleSetIn)}` : ''}
              </Tag>
            )}
          </Space>
        )}
        {j.escorts.byRoadType.map((b) => (
          <div key={b.roadType} style={{ marginTop: 6 }}>
            <Typography.Text strong>{b.roadType}</Typography.Text>: {b.front} front, {b.rear} rear{b.heightPole ? ', with height pole' : ''}
            {b.reasons.map((r, i) => (
              <ReasonLine key={i} r={r} />
            ))}
          </div>
        ))}
      </div>

      <Typography.Title level={5}>Signs, flags and lamps</Typography.Title>
      {m.notOnFile && (m.notOnFile.signs || m.notOnFile.flags || m.notOnFile.lamps) && (
        <div style={{ marginBottom: 4 }}>
          <NotOnFile>
            {[m.notOnFile.signs && 'signs', m.notOnFile.flags && 'flags', m.notOnFile.lamps && 'lamps'].filter(Boolean).join(', ')}: not on file for {j.code} — check the permit
          </NotOnFile>
        </div>
      )}
      {m.signs.length + m.flags.length + m.lamps.length + m.escortSigns.length === 0 ? (
        <span>None asked for.</span>
      ) : (
        <ul style={{ paddingLeft: 18, margin: 0 }} data-testid="jurisdiction-markings">
          {m.signs.map((s, i) => (
            <li key={`s${i}`}>
              “{s.text}” sign, at least {s.minWidthIn}×{s.minHeightIn} in, {s.letterHeightIn} in letters, {s.colors}: {s.position} · <CitedSource text={s.source} />
            </li>
          ))}
          {m.escortSigns.map((s, i) => (
            <li key={`e${i}`}>
              “{s.text}” sign, at least {s.minWidthIn}×{s.minHeightIn} in: {s.position} · <CitedSource text={s.source} />
            </li>
          ))}
          {m.flags.map((f, i) => (
            <li key={`f${i}`}>
              Flag {f.minSquareIn}×{f.minSquareIn} in, {f.colors}: {f.position} ({f.reason}) · <CitedSource text={f.source} />
            </li>
          ))}
          {m.lamps.map((l, i) => (
            <li key={`l${i}`}>
              {l.count} {l.color} lamp{l.count === 1 ? '' : 's'}: {l.position} ({l.reason}) · <CitedSource text={l.source} />
            </li>
          ))}
        </ul>
      )}

      <Typography.Title level={5}>Travel windows</Typography.Title>
      <div data-testid="travel-windows">
        {j.travel.map((t) => (
          <div key={t.date} style={{ marginBottom: 6 }}>
            <Space wrap>
              <Typography.Text strong>{dayjs(t.date).format('ddd D MMM')}</Typography.Text>
              {!t.known && <NotOnFile>{t.unknownTopics.join(', ')}: not on file — check the permit</NotOnFile>}
              {t.allowed ? (
                t.intervals.map((iv, i) => (
                  <Tag key={i} color={t.known ? 'green' : 'default'}>
                    {iv.startLocal}–{iv.endLocal}
                    {t.known ? '' : ' (rules on file only)'}
                  </Tag>
                ))
              ) : (
                <Tag color="red">no travel</Tag>
              )}
              <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                {t.timeZone}
              </Typography.Text>
            </Space>
            {t.restrictions.map((r, i) => (
              <ReasonLine key={i} r={r} />
            ))}
          </div>
        ))}
      </div>

      <Typography.Title level={5}>Fee</Typography.Title>
      {j.fee && !j.fee.known ? (
        <div data-testid="fee">
          <NotOnFile>fee: unknown — not on file for {j.code}; check the permit</NotOnFile>
        </div>
      ) : j.fee ? (
        <div data-testid="fee">
          <Typography.Text strong>{formatUsd(j.fee.totalUsd)}</Typography.Text> estimated{j.fee.refundable === false ? ', not refundable' : ''}
          <ul style={{ paddingLeft: 18, margin: '4px 0' }}>
            {j.fee.lines.map((l, i) => (
              <li key={i}>
                {l.label}: {formatUsd(l.amountUsd)} — {l.reason} · <CitedSource text={l.source} />
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <span>No permit fee (no permit needed).</span>
      )}

      {j.superload.isSuperload && (
        <>
          <Typography.Title level={5}>Superload</Typography.Title>
          {j.superload.reasons.map((r, i) => (
            <ReasonLine key={i} r={r} />
          ))}
        </>
      )}
    </div>
  );
}

function JurisdictionHeader({ j, version }: { j: JurisdictionPlanResult; version?: number }) {
  return (
    <Space wrap size={[6, 4]}>
      <Typography.Text strong>
        {j.name} ({j.code})
      </Typography.Text>
      <span style={{ color: '#475569' }}>{j.miles} mi</span>
      {j.permitRequired ? <Tag color="blue">permit needed</Tag> : <Tag color="green">no permit</Tag>}
      {j.permitRequired && !j.escorts.known ? (
        <Tag color="gold" style={{ borderStyle: 'dashed' }}>
          escorts not on file
        </Tag>
      ) : (
        j.escorts.front + j.escorts.rear > 0 && (
          <Tag color="purple">
            escorts {j.escorts.front}F/{j.escorts.rear}R
          </Tag>
        )
      )}
      {j.escorts.heightPole && <Tag color="volcano">height pole</Tag>}
      {j.governedBy && j.governedBy.topics.length > 0 && <Tag color="geekblue">permit governs</Tag>}
      {j.superload.isSuperload && <Tag color="magenta">superload</Tag>}
      {j.overweight && <Tag color="orange">overweight</Tag>}
      {j.fee && (j.fee.known ? <Tag>{formatUsd(j.fee.totalUsd)}</Tag> : <Tag style={{ borderStyle: 'dashed' }}>fee unknown</Tag>)}
      {j.openQuestions.length > 0 && (
        <Tag color="gold" style={{ borderStyle: 'dashed' }}>
          {j.openQuestions.length} not on file
        </Tag>
      )}
      {j.travel.length > 0 && j.travel.every((t) => !t.allowed) && <Tag color="red">no travel window</Tag>}
      <span style={{ fontSize: 12, color: '#64748b' }}>
        {j.ruleFound ? `${version !== undefined ? `rule v${version}, ` : ''}as of ${j.asOf}` : ''}
      </span>
      {!j.ruleFound && <Tag color="red">no rulebook record</Tag>}
    </Space>
  );
}

/** One panel per jurisdiction in route order. */
export function JurisdictionAssessments({ result, ruleVersions, expandAll }: { result: PlanCheckResult; ruleVersions?: Record<string, number>; expandAll?: boolean }) {
  return (
    <div data-testid="jurisdiction-assessments">
      <Collapse
        defaultActiveKey={expandAll ? result.jurisdictions.map((j) => j.code) : result.jurisdictions.slice(0, 1).map((j) => j.code)}
        items={result.jurisdictions.map((j) => ({
          key: j.code,
          label: <JurisdictionHeader j={j} version={ruleVersions?.[j.code]} />,
          extra: (
            <Link to={to.rulebookState(j.code)} onClick={(e) => e.stopPropagation()} style={{ fontSize: 12 }}>
              rulebook
            </Link>
          ),
          children: (
            <div data-testid={`jurisdiction-${j.code}`}>
              <JurisdictionBody j={j} />
            </div>
          ),
        }))}
      />
    </div>
  );
}
