/** Live feedback beside the move form: the instant axle check from the browser's engine, and the server's full preview. */
import { memo } from 'react';
import { Alert, Card, Grid, Spin, Tabs, Typography } from 'antd';
import { minimumTiedowns, type AssessmentDto, type MoveInput, type PlanCheckResult, type TractorDto, type TrailerDto } from '@amberline/common';
import { AxleChart, axleBars } from '../../../components/axle-chart';
import { Caution } from '../../../components/caution';
import { LoadDiagram } from '../../../components/diagram/load-diagram';
import type { ApiError } from '../../../lib/api-client';
import type { InstantAxles } from '../draft';
import { JurisdictionAssessments } from './jurisdiction-assessment';
import { AssessmentTotals, DimensionsSummary, FederalCheck, SecurementList } from './plan-results';

type Props = {
  instant: InstantAxles | null;
  tractor?: TractorDto;
  trailer?: TrailerDto;
  /** The pieces of the draft that are complete enough to draw. */
  articles: MoveInput['articles'];
  sliderSettingFt: number | null | undefined;
  missing: string[];
  preview: { data?: AssessmentDto; isFetching: boolean; error: Error | null; stale: boolean };
};

export function LiveFeedback({ instant, tractor, trailer, articles, sliderSettingFt, missing, preview }: Props) {
  const r = preview.data?.result;
  const screens = Grid.useBreakpoint();
  const narrow = !screens.sm;
  const err = preview.error as ApiError | null;
  return (
    <div data-testid="live-feedback">
      <Caution kind="both" />
      {instant ? (
        <Card size="small" title="Axle groups (live)" style={{ marginBottom: 12 }}>
          <AxleChart bars={axleBars(instant.axles, instant.check, tractor?.driveAxleOffsetsFt.length ?? 2, trailer?.axleOffsetsFt.length ?? 2)} />
          {instant.warnings.map((w) => (
            <Alert key={w} type="error" showIcon title={w} style={{ marginTop: 8 }} />
          ))}
          <div style={{ marginTop: 8 }}>
            <FederalCheck check={instant.check} />
          </div>
        </Card>
      ) : (
        <Alert type="info" showIcon title="Pick a tractor and trailer and enter a piece's size, weight and position to see the axle groups." style={{ marginBottom: 12 }} />
      )}
      {tractor && trailer && articles.length > 0 && (
        <Card size="small" title="This load on this trailer" style={{ marginBottom: 12 }}>
          <LoadDiagram
            plan={{ tractor, trailer, articles, sliderSettingFt }}
            markings={r?.markings ?? null}
            views={['side', 'top']}
          />
        </Card>
      )}
      <Card
        size="small"
        title={
          <span>
            Assessment {preview.isFetching && <Spin size="small" style={{ marginLeft: 8 }} />}
          </span>
        }
        style={{ opacity: preview.stale ? 0.6 : 1 }}
        data-testid="preview-card"
      >
        {missing.length > 0 && (
          <Alert
            type="info"
            showIcon
            style={{ marginBottom: 8 }}
            title="Still missing"
            description={
              <ul style={{ margin: 0, paddingLeft: 18 }} data-testid="draft-missing">
                {missing.slice(0, 8).map((m) => (
                  <li key={m}>{m}</li>
                ))}
                {missing.length > 8 && <li>and {missing.length - 8} more</li>}
              </ul>
            }
          />
        )}
        {err && (
          <Alert
            type="error"
            showIcon
            style={{ marginBottom: 8 }}
            title={err.message}
            description={
              err.fieldErrors?.().length ? (
                <ul style={{ margin: 0, paddingLeft: 18 }}>
                  {err.fieldErrors().map((f) => (
                    <li key={f.name}>
                      {f.name}: {f.errors.join(', ')}
                    </li>
                  ))}
                </ul>
              ) : undefined
            }
            data-testid="preview-error"
          />
        )}
        {!r && !err && !preview.isFetching && <Typography.Text type="secondary">The assessment appears here as soon as the draft is complete enough.</Typography.Text>}
        {r && <PreviewResults result={r} ruleVersions={preview.data?.ruleVersions} narrow={narrow} />}
      </Card>
    </div>
  );
}

/** The server's preview, drawn again only when a new preview arrives (not on every keystroke in the form). */
const PreviewResults = memo(function PreviewResults({ result: r, ruleVersions, narrow }: { result: PlanCheckResult; ruleVersions?: Record<string, number>; narrow: boolean }) {
  return (
    <Tabs
      size="small"
      items={[
        {
          key: 'route',
          label: 'By state',
          children: (
            <>
              <AssessmentTotals result={r} column={narrow ? 1 : 2} />
              <div style={{ marginTop: 8 }}>
                <JurisdictionAssessments result={r} ruleVersions={ruleVersions} />
              </div>
            </>
          ),
        },
        { key: 'dims', label: 'Dimensions', children: <DimensionsSummary result={r} column={narrow ? 1 : 2} /> },
        { key: 'secure', label: 'Securement', children: <SecurementList result={r} /> },
      ]}
    />
  );
});

/** The tiedowns 49 CFR 393.110 asks for one piece, for the hint beside its tiedown list. */
export function requiredTiedowns(lengthIn: number | undefined, weightLb: number | null | undefined, blockedForward: boolean, heavy: boolean): number | null {
  if (!lengthIn || !weightLb || weightLb <= 0) return null;
  try {
    const n = minimumTiedowns({ lengthFt: lengthIn / 12, weightLb, blockedForward });
    return heavy && weightLb > 10_000 ? Math.max(4, n) : n;
  } catch {
    return null;
  }
}
