import { useState } from 'react';
import { Alert, Breadcrumb, Button, Card, Modal, Space, Spin, Table, Tag, Typography } from 'antd';
import { Link, useParams } from 'react-router-dom';
import { RULEBOOK_CAUTION, coverageRow, isFactRecord, type RuleVersionDto } from '@amberline/common';
import dayjs from 'dayjs';
import { RuleDiff } from '../../../features/rulebook/components/rule-diff';
import { useRule } from '../../../features/rulebook/api/get-rule';
import { useRuleVersions } from '../../../features/rulebook/api/get-rule-versions';
import { RuleEditor } from '../../../features/rulebook/components/rule-editor';
import { RuleRecordView } from '../../../features/rulebook/components/rule-record-view';
import { paths } from '../../../config/paths';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';

/** One jurisdiction's current rule record, each value with its source and as-of, and the record's versions. */
export function RulebookStatePage() {
  const { code = '' } = useParams();
  const { user } = useAuth();
  const canEdit = accessFor(user?.role).canEditRulebook;
  const rule = useRule(code.toUpperCase());
  const versions = useRuleVersions(code.toUpperCase());
  const [editing, setEditing] = useState(false);
  const [shown, setShown] = useState<RuleVersionDto | null>(null);
  const [compare, setCompare] = useState<RuleVersionDto | null>(null);

  if (rule.isPending) return <Spin style={{ display: 'block', margin: 48 }} />;
  if (rule.isError) return <Alert type="error" showIcon title={rule.error.message} />;
  const current = rule.data;
  const view = shown ?? current;
  const counts = isFactRecord(current.record) ? coverageRow(current.record) : null;

  return (
    <div>
      <Breadcrumb style={{ marginBottom: 8 }} items={[{ title: <Link to={paths.rulebook}>Rulebook</Link> }, { title: current.record.name }]} />
      <Space style={{ width: '100%', justifyContent: 'space-between' }} wrap>
        <Space wrap align="center">
          <Typography.Title level={2} style={{ margin: 0 }}>
            {current.record.name} ({current.code})
          </Typography.Title>
          <Tag>v{current.version}</Tag>
          <Typography.Text type="secondary">as of {current.record.asOf}</Typography.Text>
          {counts && (
            <Typography.Text data-testid="fact-counts">
              {counts.sourced} sourced · {counts.secondary} secondary · {counts.unknown} not on file
            </Typography.Text>
          )}
        </Space>
        {canEdit && (
          <Button onClick={() => setEditing(true)} data-testid="edit-rule">
            Edit record
          </Button>
        )}
      </Space>
      <Alert
        style={{ margin: '12px 0' }}
        type="warning"
        showIcon
        data-testid="rulebook-banner"
        title="Every value names the text it was read in; a topic not on file is an open question"
        description={`A value not on file reads “not on file — check the permit” on moves, the permit desk and run sheets, never as “none”. ${RULEBOOK_CAUTION}`}
      />
      {shown && shown.version !== current.version && (
        <Alert
          type="info"
          showIcon
          style={{ marginBottom: 12 }}
          title={`Showing version ${shown.version} (${dayjs(shown.createdAt).format('D MMM YYYY')}), not the current one`}
          action={<Button size="small" onClick={() => setShown(null)}>Show current</Button>}
        />
      )}
      <RuleRecordView record={view.record} />
      <Card size="small" title="Versions" data-testid="rule-versions">
        <Table<RuleVersionDto>
          size="small"
          rowKey="version"
          loading={versions.isPending}
          dataSource={versions.data}
          pagination={false}
          scroll={{ x: 520 }}
          columns={[
            { title: 'Version', dataIndex: 'version', width: 80, render: (v: number) => `v${v}` },
            { title: 'Saved', dataIndex: 'createdAt', width: 150, render: (d: string) => dayjs(d).format('D MMM YYYY HH:mm') },
            { title: 'By', dataIndex: 'createdBy', width: 150, render: (b: string | null) => b ?? 'seed' },
            { title: 'Note', dataIndex: 'note' },
            { title: 'As of', width: 110, render: (_, v) => v.record.asOf },
            { title: '', width: 80, render: (_, v) => <Button size="small" type="link" onClick={() => setShown(v)}>Show</Button> },
            {
              title: '',
              width: 150,
              render: (_, v) =>
                v.version !== current.version && (
                  <Button size="small" type="link" onClick={() => setCompare(v)} data-testid={`compare-v${v.version}`}>
                    Compare with current
                  </Button>
                ),
            },
          ]}
        />
      </Card>
      <Modal open={!!compare} onCancel={() => setCompare(null)} footer={null} width={1100} title={compare ? `${current.code}: v${compare.version} and v${current.version} side by side` : ''}>
        {compare && <RuleDiff from={compare} to={current} />}
      </Modal>
      {canEdit && <RuleEditor open={editing} code={current.code} record={current.record} onClose={() => setEditing(false)} />}
    </div>
  );
}
