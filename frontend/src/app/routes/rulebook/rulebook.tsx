import { useMemo, useState } from 'react';
import { Input, Space, Table, Tag, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { JurisdictionSummaryDto } from '@amberline/common';
import dayjs from 'dayjs';
import { Caution } from '../../../components/caution';
import { SampleTag } from '../../../components/rule-source';
import { useJurisdictions } from '../../../features/rulebook/api/get-jurisdictions';
import { to } from '../../../config/paths';

/** The 48 contiguous states and DC with the current version of each rule record. */
export function RulebookPage() {
  const list = useJurisdictions();
  const [q, setQ] = useState('');
  const rows = useMemo(() => {
    const s = q.trim().toLowerCase();
    return (list.data ?? []).filter((j) => !s || j.code.toLowerCase().includes(s) || j.name.toLowerCase().includes(s));
  }, [list.data, q]);
  const sampled = (list.data ?? []).filter((j) => j.sample).length;
  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 12 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>
          Rulebook
        </Typography.Title>
        <Input.Search placeholder="State or code" allowClear onChange={(e) => setQ(e.target.value)} style={{ width: 220 }} />
      </Space>
      <Caution kind="rulebook" />
      {list.data && (
        <Typography.Paragraph type="secondary">
          {list.data.length} jurisdictions; {sampled} hold sample values in at least one part.
        </Typography.Paragraph>
      )}
      <Table<JurisdictionSummaryDto>
        rowKey="code"
        size="small"
        loading={list.isPending}
        dataSource={rows}
        pagination={false}
        scroll={{ x: 560 }}
        data-testid="rulebook-table"
        columns={[
          { title: 'Code', dataIndex: 'code', width: 70, render: (c: string) => <Link to={to.rulebookState(c)}>{c}</Link> },
          { title: 'Jurisdiction', dataIndex: 'name', render: (n: string, j) => <Link to={to.rulebookState(j.code)}>{n}</Link> },
          { title: 'Version', dataIndex: 'version', width: 90, render: (v: number) => <Tag>v{v}</Tag> },
          { title: 'As of', dataIndex: 'asOf', width: 120 },
          { title: 'Data', dataIndex: 'sample', width: 130, render: (s: boolean) => (s ? <SampleTag /> : <Tag color="green">sourced</Tag>) },
          { title: 'Last change', dataIndex: 'updatedAt', width: 150, render: (d: string) => dayjs(d).format('D MMM YYYY') },
        ]}
      />
    </div>
  );
}
