import { useState } from 'react';
import { Button, Card, Input, Space, Table, Tag, Typography } from 'antd';
import { ANCHOR_KIND_LABELS, formatFeetInches, formatPounds, TRAILER_TYPE_LABELS, type TractorDto, type TrailerDto } from '@amberline/common';
import { Caution } from '../../../components/caution';
import { useTractors } from '../../../features/fleet/api/get-tractors';
import { useTrailers } from '../../../features/fleet/api/get-trailers';
import { TractorDrawer, TrailerDrawer } from '../../../features/fleet/components/fleet-forms';
import { accessFor } from '../../../lib/access';
import { useAuth } from '../../../lib/auth';

export function FleetPage() {
  const { user } = useAuth();
  const canEdit = accessFor(user?.role).canEditFleet;
  const tractors = useTractors();
  const trailers = useTrailers();
  const [tractor, setTractor] = useState<TractorDto | null | undefined>(undefined);
  const [trailer, setTrailer] = useState<TrailerDto | null | undefined>(undefined);
  const [q, setQ] = useState('');
  const match = (...texts: string[]) => !q.trim() || texts.some((t) => t.toLowerCase().includes(q.trim().toLowerCase()));

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 12 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>
          Fleet
        </Typography.Title>
        <Input.Search placeholder="Unit number or plate" allowClear onChange={(e) => setQ(e.target.value)} style={{ width: 240 }} data-testid="fleet-search" />
      </Space>
      <Caution />
      <Card
        title="Tractors"
        style={{ marginBottom: 16 }}
        extra={canEdit && <Button type="primary" onClick={() => setTractor(null)} data-testid="add-tractor">Add tractor</Button>}
      >
        <Table<TractorDto>
          rowKey="id"
          size="small"
          loading={tractors.isPending}
          dataSource={tractors.data?.filter((t) => match(t.unitNumber, t.plate))}
          pagination={{ pageSize: 10, hideOnSinglePage: true }}
          scroll={{ x: 760 }}
          data-testid="tractors-table"
          columns={[
            { title: 'Unit', dataIndex: 'unitNumber', render: (u: string, t) => <Space>{u}{!t.active && <Tag>inactive</Tag>}</Space> },
            { title: 'Plate', dataIndex: 'plate' },
            { title: 'Empty steer / drive', render: (_, t) => `${formatPounds(t.steerTareLb)} / ${formatPounds(t.driveTareLb)}` },
            { title: 'Wheelbase', render: (_, t) => `${t.wheelbaseFt} ft` },
            { title: 'Fifth wheel', render: (_, t) => `${t.fifthWheelAheadOfDriveFt} ft ahead of drive${t.fifthWheelRangeFt ? `, slides ${t.fifthWheelRangeFt.min}–${t.fifthWheelRangeFt.max} ft` : ''}` },
            { title: 'Drive axles', render: (_, t) => t.driveAxleOffsetsFt.length },
            ...(canEdit ? [{ title: '', render: (_: unknown, t: TractorDto) => <Button size="small" onClick={() => setTractor(t)}>Edit</Button> }] : []),
          ]}
        />
      </Card>
      <Card title="Trailers" extra={canEdit && <Button type="primary" onClick={() => setTrailer(null)} data-testid="add-trailer">Add trailer</Button>}>
        <Table<TrailerDto>
          rowKey="id"
          size="small"
          loading={trailers.isPending}
          dataSource={trailers.data?.filter((t) => match(t.unitNumber, TRAILER_TYPE_LABELS[t.type]))}
          pagination={{ pageSize: 10, hideOnSinglePage: true }}
          scroll={{ x: 900 }}
          data-testid="trailers-table"
          expandable={{
            expandedRowRender: (t) => (
              <div style={{ fontSize: 13 }}>
                <div>Decks: {t.decks.map((d) => `${d.name} ${formatFeetInches(d.fromFrontIn)}–${formatFeetInches(d.toFrontIn)} at ${formatFeetInches(d.heightIn)}`).join('; ')}</div>
                <div>Anchor points: {t.anchorPoints.map((a) => `${ANCHOR_KIND_LABELS[a.kind]} ×${a.countPerSide} per side, ${formatPounds(a.wllLb)}`).join('; ') || 'none on file'}</div>
                <div>Gauge calibration: {t.gaugeCalibration.map((g) => `${g.psi} psi = ${formatPounds(g.loadLb)}`).join('; ') || 'none'}</div>
                <div>Tires: {t.tireSize ?? '—'}; tare center {t.tareCgFromKingpinFt} ft behind the kingpin; kingpin {t.kingpinFromFrontIn} in behind the front</div>
              </div>
            ),
          }}
          columns={[
            { title: 'Unit', dataIndex: 'unitNumber', render: (u: string, t) => <Space>{u}{!t.active && <Tag>inactive</Tag>}</Space> },
            { title: 'Type', dataIndex: 'type', render: (k: TrailerDto['type']) => TRAILER_TYPE_LABELS[k] },
            { title: 'Length × width', render: (_, t) => `${formatFeetInches(t.lengthIn)} × ${formatFeetInches(t.widthIn)}` },
            { title: 'Tare', render: (_, t) => formatPounds(t.tareLb) },
            { title: 'Axles', render: (_, t) => t.axleOffsetsFt.length },
            { title: 'Axle group (behind kingpin)', render: (_, t) => (t.slider ? `slides ${t.slider.minFromKingpinFt}–${t.slider.maxFromKingpinFt} ft, holes ${t.slider.holeSpacingIn} in` : `fixed at ${t.axleGroupFromKingpinFt} ft`) },
            ...(canEdit ? [{ title: '', render: (_: unknown, t: TrailerDto) => <Button size="small" onClick={() => setTrailer(t)}>Edit</Button> }] : []),
          ]}
        />
      </Card>
      {canEdit && (
        <>
          <TractorDrawer open={tractor !== undefined} tractor={tractor ?? null} onClose={() => setTractor(undefined)} />
          <TrailerDrawer open={trailer !== undefined} trailer={trailer ?? null} onClose={() => setTrailer(undefined)} />
        </>
      )}
    </div>
  );
}
