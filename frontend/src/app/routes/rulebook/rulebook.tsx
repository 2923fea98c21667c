import { useMemo, useState } from 'react';
import { Input, Space, Table, Tag, Tooltip, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { CoverageCell, CoverageRow } from '@amberline/common';
import { Caution } from '../../../components/caution';
import { useRulebookCoverage } from '../../../features/rulebook/api/get-coverage';
import { to } from '../../../config/paths';

const CELL_STYLE: Record<CoverageCell['status'], { bg: string; fg: string; border: string; label: string }> = {
  sourced: { bg: '#dcfce7', fg: '#14532d', border: 'solid', label: 'sourced' },
  secondary: { bg: '#fef9c3', fg: '#713f12', border: 'solid', label: 'secondary' },
  partial: { bg: '#fffbeb', fg: '#92400e', border: 'dashed', label: 'partly' },
  unknown: { bg: '#f8fafc', fg: '#64748b', border: 'dashed', label: 'not on file' },
};

function Cell({ c }: { c: CoverageCell }) {
  const s = CELL_STYLE[c.status];
  return (
    <Tooltip title={`${c.sourced} sourced, ${c.secondary} secondary, ${c.unknown} not on file${c.oldestAsOf ? `; oldest read ${c.oldestAsOf}` : ''}`}>
      <span
        data-testid={`cell-${c.topic}`}
        data-status={c.status}
        style={{ display: 'inline-block', minWidth: 74, textAlign: 'center', background: s.bg, color: s.fg, border: `1px ${s.border} ${s.fg}`, borderRadius: 4, fontSize: 12, padding: '0 4px' }}
      >
        {s.label}
      </span>
    </Tooltip>
  );
}

/** The rulebook overview: the 48 contiguous states and DC × topics, each cell sourced, secondary, partly or not on file. */
export function RulebookPage() {
  const cov = useRulebookCoverage();
  const [q, setQ] = useState('');
  const rows = useMemo(() => {
    const s = q.trim().toLowerCase();
    return (cov.data?.rows ?? []).filter((j) => !s || j.code.toLowerCase().includes(s) || j.name.toLowerCase().includes(s));
  }, [cov.data, q]);
  const t = cov.data?.totals;
  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 12 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>
          Rulebook
        </Typography.Title>
        <Input.Search placeholder="State or code" allowClear onChange={(e) => setQ(e.target.value)} style={{ width: 220 }} />
      </Space>
      <Caution kind="rulebook" />
      {t && (
        <Typography.Paragraph data-testid="coverage-totals">
          {t.jurisdictions} jurisdictions, {t.facts} values: <strong>{t.sourced}</strong> sourced, <strong>{t.secondary}</strong> secondary,{' '}
          <strong>{t.unknown}</strong> not on file ({Math.round(((t.sourced + t.secondary) / Math.max(1, t.facts)) * 100)}% on file). Oldest value read {t.oldestAsOf ?? '—'}.
          <br />
          <Typography.Text type="secondary" style={{ fontSize: 12 }}>
            <em>sourced</em>: every value of the topic read in the state&apos;s own statute, code or DOT / state-patrol documents · <em>secondary</em>: all on file, some from a
            federal or university summary · <em>partly</em>: some values on file · <em>not on file</em>: none; moves read it as an open question for the permit.
          </Typography.Text>
        </Typography.Paragraph>
      )}
      <Table<CoverageRow>
        rowKey="code"
        size="small"
        loading={cov.isPending}
        dataSource={rows}
        pagination={false}
        scroll={{ x: 1300 }}
        data-testid="rulebook-table"
        columns={[
          { title: 'Jurisdiction', dataIndex: 'name', fixed: 'left', width: 170, render: (n: string, j) => <Link to={to.rulebookState(j.code)}>{n} ({j.code})</Link> },
          { title: 'Version', dataIndex: 'version', width: 70, render: (v: number | null) => (v ? <Tag>v{v}</Tag> : null) },
          ...(cov.data?.topics ?? []).map((topic, i) => ({
            title: topic.label,
            key: topic.key,
            width: 96,
            render: (_: unknown, r: CoverageRow) => <Cell c={r.cells[i]} />,
          })),
          { title: 'On file', width: 90, render: (_: unknown, r: CoverageRow) => `${r.sourced + r.secondary} / ${r.sourced + r.secondary + r.unknown}` },
          { title: 'Oldest read', dataIndex: 'oldestAsOf', width: 110, render: (d: string | null) => d ?? '—' },
        ]}
      />
    </div>
  );
}
