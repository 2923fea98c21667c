import { useState } from 'react';
import { App, Button, Drawer, Form, Input, Select, Space, Switch, Table, Tag, Typography } from 'antd';
import { LIMITS, ROLE_LABELS, ROLES, type CreateUserRequest, type Role, type UserDto } from '@amberline/common';
import { useCreateUser } from '../../../features/users/api/create-user';
import { useUsers, type UsersFilter } from '../../../features/users/api/get-users';
import { useUpdateUser } from '../../../features/users/api/update-user';
import { ApiError } from '../../../lib/api-client';
import { useAuth } from '../../../lib/auth';

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export function UsersPage() {
  const { message } = App.useApp();
  const { user: me } = useAuth();
  const [filter, setFilter] = useState<UsersFilter>({ page: 1, pageSize: 20 });
  const [creating, setCreating] = useState(false);
  const users = useUsers(filter);
  const update = useUpdateUser();

  const change = (u: UserDto, body: { role?: Role; active?: boolean }) =>
    update.mutate({ id: u.id, ...body }, {
      onSuccess: () => message.success(`${u.name} updated`),
      onError: (e) => message.error(e.message),
    });

  return (
    <div>
      <Space style={{ width: '100%', justifyContent: 'space-between', marginBottom: 16 }} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>Users</Typography.Title>
        <Space wrap>
          <Input.Search placeholder="Name or e-mail" allowClear onSearch={(search) => setFilter((f) => ({ ...f, page: 1, search: search || undefined }))} style={{ width: 220 }} />
          <Select allowClear placeholder="Any role" options={roleOptions} style={{ width: 160 }} onChange={(role?: Role) => setFilter((f) => ({ ...f, page: 1, role }))} />
          <Button type="primary" onClick={() => setCreating(true)}>Add user</Button>
        </Space>
      </Space>
      <Table<UserDto>
        rowKey="id"
        loading={users.isFetching}
        dataSource={users.data?.items}
        pagination={{ current: filter.page, pageSize: filter.pageSize, total: users.data?.total, onChange: (page, pageSize) => setFilter((f) => ({ ...f, page, pageSize })) }}
        scroll={{ x: 700 }}
        columns={[
          { title: 'Name', dataIndex: 'name' },
          { title: 'E-mail', dataIndex: 'email' },
          {
            title: 'Role', dataIndex: 'role',
            render: (role: Role, u) => <Select size="small" value={role} options={roleOptions} disabled={u.id === me?.id} onChange={(r: Role) => change(u, { role: r })} style={{ width: 140 }} />,
          },
          {
            title: 'Active', dataIndex: 'active',
            render: (active: boolean, u) => (
              <Space>
                <Switch size="small" checked={active} disabled={u.id === me?.id} onChange={(v) => change(u, { active: v })} aria-label={`active ${u.email}`} />
                {!active && <Tag>deactivated</Tag>}
              </Space>
            ),
          },
        ]}
      />
      <CreateUserDrawer open={creating} onClose={() => setCreating(false)} />
    </div>
  );
}

function CreateUserDrawer({ open, onClose }: { open: boolean; onClose: () => void }) {
  const [form] = Form.useForm<CreateUserRequest>();
  const { message } = App.useApp();
  const create = useCreateUser();
  const submit = (values: CreateUserRequest) =>
    create.mutate(values, {
      onSuccess: (u) => {
        message.success(`${u.name} can now sign in`);
        form.resetFields();
        onClose();
      },
      onError: (e) => (e instanceof ApiError && e.fieldErrors().length ? form.setFields(e.fieldErrors() as Parameters<typeof form.setFields>[0]) : message.error(e.message)),
    });
  return (
    <Drawer title="Add user" open={open} onClose={onClose} size={420} destroyOnHidden>
      <Form form={form} layout="vertical" onFinish={submit} initialValues={{ role: 'dispatcher' }}>
        <Form.Item name="name" label="Name" rules={[{ required: true }, { max: LIMITS.nameMax }]}><Input /></Form.Item>
        <Form.Item name="email" label="E-mail" rules={[{ required: true }, { type: 'email' }]}><Input /></Form.Item>
        <Form.Item name="role" label="Role" rules={[{ required: true }]}><Select options={roleOptions} /></Form.Item>
        <Form.Item name="password" label="First password" rules={[{ required: true }, { min: LIMITS.passwordMin }]}><Input.Password /></Form.Item>
        <Button type="primary" htmlType="submit" loading={create.isPending}>Create</Button>
      </Form>
    </Drawer>
  );
}
