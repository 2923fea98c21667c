import { useState } from 'react';
import { Button, Drawer, Input, Select, Space, Switch, Table, Tag, Tooltip, Typography } from 'antd';
import { ESCORT_CERTIFICATION_NOTE, JURISDICTIONS, type VendorDto, type VendorsQuery } from '@amberline/common';
import { usd } from '../../../features/escorts/components/escort-tags';
import { VendorForm } from '../../../features/escorts/components/vendor-form';
import { useVendors } from '../../../features/escorts/api/get-vendors';

/** Escort vendors: who covers which states, their operators' certificates, insurance, equipped vehicles and rates. */
export function VendorsPage() {
  const [filter, setFilter] = useState<VendorsQuery>({});
  const [editing, setEditing] = useState<VendorDto | 'new' | null>(null);
  const vendors = useVendors(filter);

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 16 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>Escort vendors</Typography.Title>
        <Space wrap>
          <Input.Search placeholder="Company, contact or e-mail" allowClear onSearch={(search) => setFilter((f) => ({ ...f, search: search || undefined }))} style={{ width: 240 }} />
          <Select
            allowClear
            placeholder="Any state"
            showSearch={{ optionFilterProp: 'label' }}
            options={JURISDICTIONS.map((j) => ({ value: j.code, label: `${j.code} · ${j.name}` }))}
            style={{ width: 180 }}
            onChange={(state?: string) => setFilter((f) => ({ ...f, state }))}
          />
          <Space>
            <Switch size="small" onChange={(v) => setFilter((f) => ({ ...f, includeInactive: v || undefined }))} aria-label="show inactive" />
            <Typography.Text type="secondary">inactive too</Typography.Text>
          </Space>
          <Button type="primary" onClick={() => setEditing('new')} data-testid="add-vendor">Add vendor</Button>
        </Space>
      </Space>
      <Table<VendorDto>
        rowKey="id"
        loading={vendors.isFetching}
        dataSource={vendors.data}
        pagination={{ pageSize: 25, hideOnSinglePage: true }}
        scroll={{ x: 1100 }}
        data-testid="vendors-table"
        columns={[
          {
            title: 'Company',
            render: (_, v) => (
              <div>
                <Button type="link" style={{ padding: 0 }} onClick={() => setEditing(v)}>{v.company}</Button>
                {!v.active && <Tag style={{ marginLeft: 6 }}>inactive</Tag>}
                <div><Typography.Text type="secondary" style={{ fontSize: 12 }}>{v.contactName} · {v.email} · {v.phone}</Typography.Text></div>
              </div>
            ),
          },
          { title: 'States', render: (_, v) => <Space size={[2, 2]} wrap>{v.states.map((s) => <Tag key={s}>{s}</Tag>)}</Space> },
          {
            title: 'Operators',
            render: (_, v) => (
              <div style={{ fontSize: 12 }}>
                {v.operators.map((o) => (
                  <div key={o.name}>
                    {o.name}
                    {o.certifications.length ? <Typography.Text type="secondary"> · {o.certifications.map((c) => `${c.state} certificate valid to ${c.expires}`).join(', ')}</Typography.Text> : null}
                  </div>
                ))}
              </div>
            ),
          },
          {
            title: 'Insurance',
            render: (_, v) => (
              <span style={{ fontSize: 12 }}>
                {usd(v.insurance.liabilityLimitUsd)} · to {v.insurance.expires}
              </span>
            ),
          },
          {
            title: 'Vehicles',
            render: (_, v) => (
              <span style={{ fontSize: 12 }}>
                {v.vehicles.length} ({v.vehicles.filter((x) => x.equipment.heightPole).length} with height pole)
              </span>
            ),
          },
          {
            title: 'Rates',
            render: (_, v) => (
              <span style={{ fontSize: 12 }}>
                {v.rates.basis === 'per_mile' ? `${usd(v.rates.perMileUsd)}/mi` : `${usd(v.rates.perDayUsd)}/day`}
                {v.rates.minimumUsd !== undefined ? `, min ${usd(v.rates.minimumUsd)}` : ''}
                {v.rates.noGoUsd !== undefined ? `, no-go ${usd(v.rates.noGoUsd)}` : ''}
                {v.rates.layoverUsd !== undefined ? `, layover ${usd(v.rates.layoverUsd)}` : ''}
              </span>
            ),
          },
          {
            title: 'Certificates & insurance',
            render: (_, v) =>
              v.warnings.length ? (
                <Tooltip title={v.warnings.join('; ')}><Tag color="error">{v.warnings.length} lapsed</Tag></Tooltip>
              ) : (
                <Tag color="success">current</Tag>
              ),
          },
        ]}
      />
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, marginTop: 8 }}>{ESCORT_CERTIFICATION_NOTE}</Typography.Paragraph>
      <Drawer title={editing === 'new' ? 'Add vendor' : editing ? editing.company : ''} open={!!editing} onClose={() => setEditing(null)} size={720} destroyOnHidden>
        {editing && <VendorForm vendor={editing === 'new' ? null : editing} onDone={() => setEditing(null)} />}
      </Drawer>
    </div>
  );
}
