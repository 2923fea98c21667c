import { Alert, Tag, Typography } from 'antd';
import type { RunSheetDto } from '@amberline/common';
import { lb } from '../format';
import { Fact, Facts } from './section';

const RULE_LABELS: Record<string, string> = { single: 'single axle', tandem: 'tandem', 'bridge-formula': 'bridge formula', 'two-tandem-exception': 'two tandems', gross: 'gross' };

/** Planned axle-group weights, the sliding-axle setting and the federal check of each group. */
export function AxlesSection({ sheet }: { sheet: RunSheetDto }) {
  const a = sheet.axles;
  return (
    <div data-testid="axles">
      <Facts>
        <Fact label="Steer">{lb(a.steerLb)}</Fact>
        <Fact label="Drive group">{lb(a.driveLb)}</Fact>
        <Fact label="Trailer group">{lb(a.trailerLb)}</Fact>
        <Fact label="Gross">{lb(a.grossLb)}</Fact>
        <Fact label="Sliding axle" testId="slider-setting">
          {a.sliderSettingFt !== null ? `${a.sliderSettingFt} ft behind the kingpin` : "trailer's fixed setting"}
        </Fact>
      </Facts>
      {a.federal.groups.length > 0 && (
        <Typography.Paragraph style={{ fontSize: 13, margin: '10px 0 4px' }} data-testid="federal-summary">
          Federal legal weights: {a.federal.groups.length - a.federal.violations.length} of {a.federal.groups.length} axle groups within.
        </Typography.Paragraph>
      )}
      {a.federal.violations.length > 0 && (
        <Alert
          type="warning"
          showIcon
          title="Over the federal legal weights: the permit's weights govern."
          description={
            <ul style={{ listStyle: 'none', padding: 0, margin: 0, fontSize: 13 }}>
              {a.federal.violations.map((g, i) => (
                <li key={i} style={{ padding: '2px 0' }}>
                  <Tag color="red">over {lb(g.overByLb)}</Tag>
                  {RULE_LABELS[g.rule] ?? g.rule}, axles {g.fromAxle}
                  {g.toAxle !== g.fromAxle ? `–${g.toAxle}` : ''}: {lb(g.weightLb)} of {lb(g.limitLb)}
                </li>
              ))}
            </ul>
          }
        />
      )}
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, margin: '6px 0 0' }}>
        Planned weights. Confirm them on a certified scale; set and pin the sliding axle at the setting above.
      </Typography.Paragraph>
    </div>
  );
}
