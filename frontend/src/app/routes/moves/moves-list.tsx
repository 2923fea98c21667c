import { useMemo } from 'react';
import { Button, Card, Col, Input, Row, Select, Space, Statistic, Table, Typography } from 'antd';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { JURISDICTIONS, MOVE_STAGE_LABELS, MOVE_STAGES, type MoveStage, type MoveSummaryDto } from '@amberline/common';
import dayjs from 'dayjs';
import { useMoves } from '../../../features/moves/api/get-moves';
import type { MovesFilter } from '../../../lib/shared-queries';
import { useStageCounts } from '../../../features/moves/api/get-stage-counts';
import { MoveFlags } from '../../../features/moves/components/move-flags';
import { STAGE_COLORS, StageTag } from '../../../components/stage-tag';
import { paths, to } from '../../../config/paths';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';

const SORTS: { value: NonNullable<MovesFilter['sort']>; label: string }[] = [
  { value: 'departure', label: 'Departure, soonest first' },
  { value: '-departure', label: 'Departure, latest first' },
  { value: 'updated', label: 'Recently changed' },
];

/** The filter lives in the address, so a filtered list can be shared and survives a reload. */
function useFilter(): [MovesFilter, (f: Partial<MovesFilter>) => void] {
  const [params, setParams] = useSearchParams();
  const filter = useMemo<MovesFilter>(() => {
    const stage = params.get('stage');
    const sort = params.get('sort');
    return {
      page: Math.max(1, Number(params.get('page')) || 1),
      pageSize: Math.min(100, Math.max(5, Number(params.get('pageSize')) || 20)),
      ...(stage && (MOVE_STAGES as readonly string[]).includes(stage) ? { stage: stage as MoveStage } : {}),
      ...(params.get('search') ? { search: params.get('search')! } : {}),
      ...(sort && SORTS.some((s) => s.value === sort) ? { sort: sort as MovesFilter['sort'] } : { sort: 'departure' as const }),
      ...(params.get('jurisdiction') ? { jurisdiction: params.get('jurisdiction')! } : {}),
    };
  }, [params]);
  const update = (patch: Partial<MovesFilter>) => {
    const next: Record<string, string> = {};
    const merged = { ...filter, page: 1, ...patch };
    for (const [k, v] of Object.entries(merged)) if (v !== undefined && v !== '' && v !== null) next[k] = String(v);
    setParams(next, { replace: true });
  };
  return [filter, update];
}

function StageOverview({ active, onPick }: { active?: MoveStage; onPick: (s?: MoveStage) => void }) {
  const counts = useStageCounts();
  const total = counts.data ? MOVE_STAGES.reduce((s, k) => s + counts.data[k], 0) : undefined;
  const card = (key: MoveStage | undefined, label: string, value: number | undefined, color?: string) => {
    const selected = active === key;
    return (
      <Col xs={12} sm={8} md={6} lg={24 / 7} key={key ?? 'all'} flex="1 1 120px">
        <Card
          size="small"
          hoverable
          onClick={() => onPick(selected ? undefined : key)}
          style={{ borderColor: selected ? '#d97706' : undefined, borderWidth: selected ? 2 : 1, borderTop: color ? `3px solid ${color}` : undefined }}
          data-testid={`stage-count-${key ?? 'all'}`}
          role="button"
          aria-pressed={selected}
        >
          <Statistic title={label} value={value ?? '–'} loading={counts.isPending} />
        </Card>
      </Col>
    );
  };
  const CSS: Record<string, string> = { blue: '#1677ff', cyan: '#13c2c2', purple: '#722ed1', gold: '#faad14', green: '#52c41a', default: '#94a3b8' };
  return (
    <Row gutter={[8, 8]} style={{ marginBottom: 16 }} data-testid="stage-overview">
      {card(undefined, 'All moves', total)}
      {MOVE_STAGES.map((s) => card(s, MOVE_STAGE_LABELS[s], counts.data?.[s], CSS[STAGE_COLORS[s]]))}
    </Row>
  );
}

export function MovesListPage() {
  const { user } = useAuth();
  const access = accessFor(user?.role);
  const navigate = useNavigate();
  const [filter, setFilter] = useFilter();
  const moves = useMoves(filter);

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 16 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>
          Moves
        </Typography.Title>
        {access.canEditMoves && (
          <Button type="primary" onClick={() => navigate(paths.moveNew)} data-testid="new-move">
            New move
          </Button>
        )}
      </Space>
      <StageOverview active={filter.stage} onPick={(stage) => setFilter({ stage })} />
      <Space wrap style={{ marginBottom: 12 }}>
        <Input.Search
          placeholder="Reference, customer, commodity, place"
          allowClear
          defaultValue={filter.search}
          onSearch={(search) => setFilter({ search: search.trim() || undefined })}
          style={{ width: 300, maxWidth: '100%' }}
          data-testid="moves-search"
        />
        <Select
          allowClear
          placeholder="Any stage"
          value={filter.stage}
          style={{ width: 170 }}
          options={MOVE_STAGES.map((s) => ({ value: s, label: MOVE_STAGE_LABELS[s] }))}
          onChange={(stage?: MoveStage) => setFilter({ stage })}
          data-testid="moves-stage-filter"
        />
        <Select
          allowClear
          showSearch={{ optionFilterProp: 'label' }}
          placeholder="Any state"
          value={filter.jurisdiction}
          style={{ width: 170 }}
          options={JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} · ${j.name}` }))}
          onChange={(jurisdiction?: string) => setFilter({ jurisdiction })}
        />
        <Select value={filter.sort} style={{ width: 210 }} options={SORTS} onChange={(sort) => setFilter({ sort })} data-testid="moves-sort" />
      </Space>
      <Table<MoveSummaryDto>
        rowKey="id"
        loading={moves.isFetching}
        dataSource={moves.data?.items}
        data-testid="moves-table"
        locale={{ emptyText: moves.isError ? moves.error.message : 'No moves match' }}
        pagination={{
          current: filter.page,
          pageSize: filter.pageSize,
          total: moves.data?.total,
          showSizeChanger: true,
          showTotal: (t) => `${t} moves`,
          onChange: (page, pageSize) => setFilter({ page, pageSize }),
        }}
        scroll={{ x: 980 }}
        onRow={(m) => ({ onDoubleClick: () => navigate(to.move(m.id)) })}
        columns={[
          {
            title: 'Move',
            dataIndex: 'reference',
            fixed: 'left',
            width: 140,
            render: (ref: string, m) => (
              <Link to={to.move(m.id)} data-testid="move-link">
                {ref}
              </Link>
            ),
          },
          { title: 'Stage', dataIndex: 'stage', width: 140, render: (s: MoveStage) => <StageTag stage={s} /> },
          {
            title: 'Departure',
            dataIndex: 'requestedDeparture',
            width: 150,
            render: (d: string) => dayjs(d).format('ddd D MMM YYYY'),
          },
          {
            title: 'Customer / load',
            render: (_, m) => (
              <div>
                <div>{m.customer}</div>
                <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                  {m.commodity}
                </Typography.Text>
              </div>
            ),
          },
          {
            title: 'From → to',
            render: (_, m) => (
              <div>
                <div>
                  {m.origin} → {m.destination}
                </div>
                <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                  {m.jurisdictions.join(' · ')}
                </Typography.Text>
              </div>
            ),
          },
          { title: 'Driver', dataIndex: 'driver', width: 130, render: (d: MoveSummaryDto['driver']) => d?.name ?? <Typography.Text type="secondary">unassigned</Typography.Text> },
          { title: 'Needs', width: 230, render: (_, m) => <MoveFlags flags={m.flags} /> },
        ]}
      />
    </div>
  );
}
