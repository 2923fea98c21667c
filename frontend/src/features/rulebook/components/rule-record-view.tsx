/** A rule record by topic: every value with its status and source; a topic not on file says so in its own style. */
import { Card, Table, Typography } from 'antd';
import { COVERAGE_TOPICS, factsOf, isFactRecord, type Fact, type JurisdictionRule } from '@amberline/common';
import { FactSource, NotOnFile } from '../../../components/rule-source';
import { FACT_LABELS, describeValue } from './fact-labels';

type Row = { key: string; label: string; fact: Fact<unknown> };

export function RuleRecordView({ record }: { record: JurisdictionRule }) {
  if (!isFactRecord(record)) {
    return (
      <Card size="small" style={{ marginBottom: 12 }}>
        <Typography.Paragraph>This version predates sourced facts; its raw record:</Typography.Paragraph>
        <pre style={{ fontSize: 11, maxHeight: 320, overflow: 'auto' }}>{JSON.stringify(record, null, 2)}</pre>
      </Card>
    );
  }
  const facts = new Map(factsOf(record));
  return (
    <div data-testid="rule-record">
      {COVERAGE_TOPICS.map((t) => (
        <Card key={t.key} size="small" title={t.label} style={{ marginBottom: 12 }}>
          <Table<Row>
            size="small"
            pagination={false}
            showHeader={false}
            scroll={{ x: 760 }}
            rowKey="key"
            dataSource={t.paths.map((p) => ({ key: p, label: FACT_LABELS[p] ?? p, fact: facts.get(p)! }))}
            columns={[
              { dataIndex: 'label', width: 240 },
              {
                dataIndex: 'fact',
                render: (f: Fact<unknown>, row) => (f.status === 'unknown' ? <NotOnFile what={f.note} /> : <span>{describeValue(row.key, f.value)}</span>),
              },
              { dataIndex: 'fact', key: 'source', width: 420, render: (f: Fact<unknown>) => (f.status === 'unknown' ? <Typography.Text type="secondary" style={{ fontSize: 12 }}>{f.note}</Typography.Text> : <FactSource fact={f} />) },
            ]}
          />
        </Card>
      ))}
      {record.researchNotes && (
        <Card size="small" title="Research notes" style={{ marginBottom: 12 }}>
          <Typography.Paragraph style={{ whiteSpace: 'pre-wrap', margin: 0 }}>{record.researchNotes}</Typography.Paragraph>
        </Card>
      )}
    </div>
  );
}
