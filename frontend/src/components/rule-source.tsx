import { Tag, Tooltip, Typography } from 'antd';
import type { RuleSource } from '@amberline/common';

/** A rule value's citation and as-of date, with a mark when it is sample data. */
export function RuleSourceNote({ source }: { source: RuleSource }) {
  return (
    <Typography.Text type="secondary" style={{ fontSize: 12 }} data-testid="rule-source">
      {source.citation} · as of {source.asOf}
      {source.sample && <SampleTag />}
      {source.note && (
        <Tooltip title={source.note}>
          <Typography.Text type="secondary" style={{ fontSize: 12, marginLeft: 4, cursor: 'help' }}>
            (note)
          </Typography.Text>
        </Tooltip>
      )}
    </Typography.Text>
  );
}

export function SampleTag() {
  return (
    <Tag color="orange" style={{ marginLeft: 6 }} data-testid="sample-tag">
      sample data
    </Tag>
  );
}

/** A citation string as the engine writes it ("… (as of …, sample data)"), with the sample mark made visible. */
export function CitedSource({ text, sample }: { text: string; sample?: boolean }) {
  const isSample = sample || /sample data/.test(text);
  return (
    <Typography.Text type="secondary" style={{ fontSize: 12 }}>
      {text.replace(/, sample data\)/, ')')}
      {isSample && <SampleTag />}
    </Typography.Text>
  );
}
