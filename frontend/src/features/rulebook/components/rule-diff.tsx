/** Two versions of a record side by side: every fact whose status, value or source differs. */
import { Table, Typography } from 'antd';
import { factsOf, isFactRecord, type Fact, type RuleVersionDto } from '@amberline/common';
import { FactSource, NotOnFile } from '../../../components/rule-source';
import { FACT_LABELS, describeValue } from './fact-labels';

type Row = { path: string; a: Fact<unknown> | undefined; b: Fact<unknown> | undefined };

const cell = (path: string, f: Fact<unknown> | undefined) =>
  !f ? (
    <Typography.Text type="secondary">—</Typography.Text>
  ) : f.status === 'unknown' ? (
    <NotOnFile what={f.note} />
  ) : (
    <div>
      <div>{describeValue(path, f.value)}</div>
      <FactSource fact={f} />
    </div>
  );

export function RuleDiff({ from, to }: { from: RuleVersionDto; to: RuleVersionDto }) {
  const a = new Map(isFactRecord(from.record) ? factsOf(from.record) : []);
  const b = new Map(isFactRecord(to.record) ? factsOf(to.record) : []);
  const paths = [...new Set([...a.keys(), ...b.keys()])];
  const rows: Row[] = paths.filter((p) => JSON.stringify(a.get(p)) !== JSON.stringify(b.get(p))).map((p) => ({ path: p, a: a.get(p), b: b.get(p) }));
  return (
    <div data-testid="rule-diff">
      <Typography.Paragraph type="secondary">
        {rows.length} value{rows.length === 1 ? '' : 's'} differ between v{from.version} and v{to.version}
        {!isFactRecord(from.record) || !isFactRecord(to.record) ? ' (a version from before sourced facts shows no facts)' : ''}.
      </Typography.Paragraph>
      <Table<Row>
        size="small"
        rowKey="path"
        pagination={false}
        dataSource={rows}
        columns={[
          { title: 'Value', dataIndex: 'path', width: 220, render: (p: string) => FACT_LABELS[p] ?? p },
          { title: `v${from.version}`, render: (_, r) => cell(r.path, r.a) },
          { title: `v${to.version}`, render: (_, r) => cell(r.path, r.b) },
        ]}
      />
    </div>
  );
}
