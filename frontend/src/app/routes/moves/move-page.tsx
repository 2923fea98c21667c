import { useState } from 'react';
import { Alert, Anchor, Breadcrumb, Button, Card, Col, Descriptions, Row, Segmented, Space, Spin, Table, Tag, Typography } from 'antd';
import { Link, useNavigate, useParams } from 'react-router-dom';
import {
  ANCHOR_KIND_LABELS,
  formatFeetInches,
  formatPounds,
  TRAILER_TYPE_LABELS,
  type MoveArticle,
  type MoveTiedown,
  type RouteSegmentDto,
  type TrailerType,
} from '@amberline/common';
import dayjs from 'dayjs';
import { AxleChart, axleBars } from '../../../components/axle-chart';
import { Caution } from '../../../components/caution';
import { LoadDiagram } from '../../../components/diagram/load-diagram';
import { useTractor } from '../../../features/fleet/api/get-tractor';
import { useTrailer } from '../../../features/fleet/api/get-trailer';
import { MoveEscorts } from '../../../features/escorts/components/move-escorts';
import { useAssessment } from '../../../features/moves/api/get-assessment';
import { useMove } from '../../../features/moves/api/get-move';
import { formatSignedFeetInches } from '../../../features/moves/draft';
import { JurisdictionAssessments } from '../../../features/moves/components/jurisdiction-assessment';
import { MoveHistory } from '../../../features/moves/components/move-history';
import { AssessmentTotals, DimensionsSummary, FederalCheck, SecurementList } from '../../../features/moves/components/plan-results';
import { StageControl } from '../../../features/moves/components/stage-control';
import { KeptRules } from '../../../features/moves/components/kept-rules';
import { ScheduleTimeline } from '../../../features/moves/components/schedule-timeline';
import { localInstant } from '../../../lib/time';
import { StageTag } from '../../../components/stage-tag';
import { MovePermits } from '../../../features/permits/components/move-permits';
import { paths, to } from '../../../config/paths';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';

const WEIGHT_SOURCE: Record<string, string> = { spec_sheet: 'spec sheet', scale_ticket: 'scale ticket', estimate: 'estimate' };

function describeTiedown(t: MoveTiedown): string {
  const what =
    t.kind === 'chain' ? `chain ${t.chainSize ?? ''} in${t.chainGrade ? ` G${t.chainGrade}` : ' (unmarked)'}` : t.kind === 'webbing' ? `webbing ${t.webbingWidth ?? ''} in` : 'other';
  return `${t.label ? `${t.label}: ` : ''}${what}${t.markedWllLb ? `, marked WLL ${formatPounds(t.markedWllLb)}` : ''}, to the ${ANCHOR_KIND_LABELS[t.anchorKind].toLowerCase()}, ${t.path}${t.edgeProtection ? ', edge guard' : ''}`;
}

export function MovePage() {
  const { id = '' } = useParams();
  const { user } = useAuth();
  const access = accessFor(user?.role);
  const navigate = useNavigate();
  const move = useMove(id);
  const assessment = useAssessment(id);
  const tractor = useTractor(move.data?.tractorId);
  const trailer = useTrailer(move.data?.trailerId);
  const [markingsOf, setMarkingsOf] = useState<string>('federal');

  if (move.isPending) return <Spin style={{ display: 'block', margin: 48 }} />;
  if (move.isError) return <Alert type="error" showIcon title={move.error.message} />;
  const m = move.data;
  const r = assessment.data?.result;
  const editable = access.canEditMoves && m.stage !== 'delivered' && m.stage !== 'cancelled';
  const markings = markingsOf === 'federal' ? r?.markings : r?.jurisdictions.find((j) => j.code === markingsOf)?.markings;

  return (
    <div data-testid="move-page">
      <Breadcrumb style={{ marginBottom: 8 }} items={[{ title: <Link to={paths.moves}>Moves</Link> }, { title: m.reference }]} />
      <Space style={{ width: '100%', justifyContent: 'space-between', alignItems: 'flex-start' }} wrap>
        <div>
          <Space align="center" wrap>
            <Typography.Title level={2} style={{ margin: 0 }} data-testid="move-reference">
              {m.reference}
            </Typography.Title>
            <StageTag stage={m.stage} />
          </Space>
          <Typography.Paragraph style={{ margin: '4px 0 0' }}>
            {m.customer}
            {m.customerRef ? ` (${m.customerRef})` : ''} · {m.commodity}
          </Typography.Paragraph>
          <Typography.Text type="secondary">
            {m.origin} → {m.destination} · departs {dayjs(m.requestedDeparture).format('ddd D MMM YYYY')}
            {m.travelDays > 1 ? `, ${m.travelDays} travel days` : ''} · driver {m.driver?.name ?? 'not assigned'}
          </Typography.Text>
        </div>
        {editable && (
          <Button onClick={() => navigate(to.moveEdit(m.id))} data-testid="edit-move">
            Edit
          </Button>
        )}
      </Space>
      {access.canEditMoves && (
        <div style={{ margin: '12px 0' }}>
          <StageControl move={m} />
        </div>
      )}
      <Anchor
        affix={false}
        direction="horizontal"
        style={{ margin: '12px 0', background: '#f8fafc' }}
        items={[
          { key: 'plan', href: '#load-plan', title: 'Load plan' },
          { key: 'route', href: '#route-assessment', title: 'Route and assessment' },
          { key: 'schedule', href: '#schedule', title: 'Day plan' },
          { key: 'permits', href: '#permits', title: 'Permits' },
          { key: 'escorts', href: '#escorts', title: 'Escorts' },
          { key: 'history', href: '#history', title: 'History' },
        ]}
      />
      <Caution kind="both" />
      {assessment.isError && <Alert type="error" showIcon title={`Assessment not available: ${assessment.error.message}`} style={{ marginBottom: 12 }} />}

      <Card id="load-plan" title="Load plan" style={{ marginBottom: 16 }} data-testid="section-load-plan">
        <Table<MoveArticle>
          size="small"
          rowKey="id"
          pagination={false}
          dataSource={m.articles}
          scroll={{ x: 820 }}
          columns={[
            { title: 'Piece', render: (_, a) => <><strong>{a.id}</strong> {a.description}</> },
            { title: 'L × W × H', render: (_, a) => `${formatFeetInches(a.lengthIn)} × ${formatFeetInches(a.widthIn)} × ${formatFeetInches(a.heightIn)}` },
            { title: 'Weight', render: (_, a) => <>{formatPounds(a.weightLb)} <Typography.Text type="secondary">({WEIGHT_SOURCE[a.weightSource]})</Typography.Text></> },
            { title: 'Center of gravity', render: (_, a) => (a.cgFromFrontIn !== undefined ? `${formatFeetInches(a.cgFromFrontIn)} behind its front` : 'middle') },
            {
              title: 'Placement',
              render: (_, a) =>
                `${formatSignedFeetInches(a.positionFromTrailerFrontIn)} from the trailer front, ${a.lateralOffsetIn ? `${a.lateralOffsetIn} in ${a.lateralOffsetIn > 0 ? 'to the curb side' : 'to the road side'}` : 'centered'}, dunnage ${a.dunnageIn ?? 0} in`,
            },
            {
              title: '',
              render: (_, a) => (
                <Space size={4} wrap>
                  {a.heavyEquipment && <Tag>heavy equipment</Tag>}
                  {a.sharpEdges && <Tag>sharp edges</Tag>}
                  {a.blockedForward && <Tag>blocked forward</Tag>}
                </Space>
              ),
            },
          ]}
        />
        <Descriptions
          size="small"
          style={{ marginTop: 12 }}
          column={{ xs: 1, sm: 3 }}
          items={[
            { key: 't', label: 'Tractor', children: tractor.data ? `${tractor.data.unitNumber} · ${tractor.data.plate}` : m.tractor.unitNumber },
            { key: 'tr', label: 'Trailer', children: `${m.trailer.unitNumber} · ${TRAILER_TYPE_LABELS[m.trailer.type as TrailerType] ?? m.trailer.type}` },
            {
              key: 's',
              label: 'Sliding axle',
              children: m.sliderSettingFt != null ? `${m.sliderSettingFt} ft behind the kingpin` : trailer.data ? `fixed, ${trailer.data.axleGroupFromKingpinFt} ft behind the kingpin` : '—',
            },
          ]}
        />
        {r && (
          <div style={{ marginTop: 12 }}>
            <DimensionsSummary result={r} />
          </div>
        )}
        {r && tractor.data && trailer.data ? (
          <Row gutter={[24, 16]} style={{ marginTop: 12 }}>
            <Col xs={24} xl={15}>
              <Space wrap style={{ marginBottom: 8 }}>
                <Typography.Text>Markings by</Typography.Text>
                <Segmented
                  size="small"
                  value={markingsOf}
                  onChange={(v) => setMarkingsOf(String(v))}
                  options={[{ value: 'federal', label: 'Federal' }, ...r.jurisdictions.map((j) => ({ value: j.code, label: j.code }))]}
                  data-testid="markings-of"
                />
              </Space>
              <LoadDiagram plan={{ tractor: tractor.data, trailer: trailer.data, articles: m.articles, sliderSettingFt: m.sliderSettingFt }} result={r} markings={markings ?? null} />
            </Col>
            <Col xs={24} xl={9}>
              <Typography.Title level={5} style={{ marginTop: 0 }}>
                Axle groups against federal limits
              </Typography.Title>
              <AxleChart bars={axleBars(r.axles, r.federal, tractor.data.driveAxleOffsetsFt.length, trailer.data.axleOffsetsFt.length)} />
              <Typography.Title level={5}>Federal legal check</Typography.Title>
              <FederalCheck check={r.federal} />
              {r.slider && (
                <Alert style={{ marginTop: 8 }} type={r.slider.found ? 'info' : 'warning'} showIcon title="Sliding axle" description={r.slider.message} data-testid="slider-note" />
              )}
            </Col>
          </Row>
        ) : (
          <Spin style={{ display: 'block', margin: 24 }} />
        )}
        <Typography.Title level={5}>Securement</Typography.Title>
        {m.articles.map((a) => (
          <div key={a.id} style={{ marginBottom: 8 }}>
            <Typography.Text strong>{a.id}</Typography.Text>: {a.tiedowns.length} tiedown{a.tiedowns.length === 1 ? '' : 's'}
            <ul style={{ margin: '2px 0', paddingLeft: 18 }}>
              {a.tiedowns.map((t, i) => (
                <li key={i}>{describeTiedown(t)}</li>
              ))}
            </ul>
          </div>
        ))}
        {r && <SecurementList result={r} names={Object.fromEntries(m.articles.map((a) => [a.id, a.description]))} />}
      </Card>

      <Card id="route-assessment" title="Route and assessment" style={{ marginBottom: 16 }} data-testid="section-assessment">
        <Table<RouteSegmentDto>
          size="small"
          rowKey="order"
          pagination={false}
          dataSource={m.route}
          scroll={{ x: 700 }}
          columns={[
            { title: '#', dataIndex: 'order', width: 40 },
            { title: 'State', dataIndex: 'jurisdiction', width: 70 },
            { title: 'Roads', dataIndex: 'roads' },
            { title: 'Miles', dataIndex: 'miles', width: 70 },
            { title: 'Road type', dataIndex: 'roadType', width: 110, render: (t: string, s) => `${t}${s.urban ? ', in town' : ''}` },
            { title: 'Point for sun times', render: (_, s) => s.place ?? `${s.lat}, ${s.lon}` },
          ]}
        />
        <Typography.Paragraph type="secondary" style={{ marginTop: 8 }}>
          Travel days: {m.travelDates.map((d) => dayjs(d).format('ddd D MMM')).join(', ')}
        </Typography.Paragraph>
        {r && assessment.data ? (
          <>
            <KeptRules move={m} assessment={assessment.data} canEdit={editable} />
            <AssessmentTotals result={r} />
            <div style={{ marginTop: 12 }}>
              <JurisdictionAssessments result={r} ruleVersions={assessment.data.ruleVersions} expandAll />
            </div>
            <Typography.Paragraph type="secondary" style={{ marginTop: 8, fontSize: 12 }}>
              Assessed {localInstant(assessment.data.computedAt)} on move version {assessment.data.moveVersion} with rulebook{' '}
              {Object.entries(assessment.data.ruleVersions)
                .map(([c, v]) => `${c} v${v}`)
                .join(', ')}
              . {assessment.data.caution}
            </Typography.Paragraph>
          </>
        ) : (
          !assessment.isError && <Spin />
        )}
      </Card>

      <Card id="schedule" title="Day plan and schedule check" style={{ marginBottom: 16 }} data-testid="section-schedule">
        <ScheduleTimeline move={m} canEdit={editable} />
      </Card>

      <Card id="permits" title="Permits" style={{ marginBottom: 16 }} data-testid="section-permits">
        <MovePermits moveId={m.id} />
      </Card>
      <Card id="escorts" title="Escorts" style={{ marginBottom: 16 }} data-testid="section-escorts">
        <MoveEscorts moveId={m.id} origin={m.origin} />
      </Card>
      <Card id="history" title="History" data-testid="section-history">
        <MoveHistory moveId={m.id} />
      </Card>
    </div>
  );
}
