import { Suspense, useEffect, useMemo, useState } from 'react';
import { Alert, App as AntApp, Button, Grid, Layout, Menu, Space, Tag, Typography } from 'antd';
import { Link, Outlet, useLocation } from 'react-router-dom';
import { ROLE_LABELS } from '@amberline/common';
import { BrandMark } from '../../components/brand-mark';
import { PageSpinner } from '../../components/page-spinner';
import { navigationFor } from '../navigation';
import { onAvailability } from '../../lib/api-client';
import { useAuth } from '../../lib/auth';

export function AppShell() {
  const { user, signOut } = useAuth();
  const location = useLocation();
  const screens = Grid.useBreakpoint();
  const items = useMemo(() => navigationFor(user?.role), [user?.role]);
  const [unavailable, setUnavailable] = useState(false);
  useEffect(() => onAvailability(setUnavailable), []);
  const selected = items
    .filter((i) => (i.path === '/' ? location.pathname === '/' : location.pathname.startsWith(i.path)))
    .map((i) => i.path);

  return (
    <AntApp>
    <Layout style={{ minHeight: '100vh' }}>
      <Layout.Header className="no-print" style={{ display: 'flex', alignItems: 'center', gap: screens.sm ? 16 : 8, paddingInline: screens.sm ? 16 : 8 }}>
        <Link to="/" style={{ display: 'flex', alignItems: 'center', gap: 8, color: '#fff' }}>
          <BrandMark />
          {/* on a phone the name gives way, so the menu items stay readable instead of folding into "…" */}
          {screens.sm && (
            <Typography.Text strong style={{ color: '#fff', fontSize: 18 }}>
              Amberline
            </Typography.Text>
          )}
        </Link>
        <Menu
          theme="dark"
          mode="horizontal"
          selectedKeys={selected}
          style={{ flex: 1, minWidth: 0, background: 'transparent' }}
          items={items.map((i) => ({ key: i.path, label: <Link to={i.path}>{i.label}</Link> }))}
          data-testid="main-nav"
        />
        {user && (
          <Space size="small">
            {screens.md && <Typography.Text style={{ color: '#e2e8f0' }}>{user.name}</Typography.Text>}
            <Tag color="gold" data-testid="current-role">
              {ROLE_LABELS[user.role]}
            </Tag>
            <Button size="small" onClick={signOut}>
              Sign out
            </Button>
          </Space>
        )}
      </Layout.Header>
      <Layout.Content style={{ padding: screens.md ? 24 : 12 }}>
        {unavailable && (
          <Alert
            type="error"
            showIcon
            style={{ marginBottom: 12 }}
            data-testid="service-unavailable"
            title="The service is unavailable for the moment"
            description="You are still signed in and nothing was lost; what you sent may not have been saved. Try again in a minute."
          />
        )}
        <Suspense fallback={<PageSpinner />}>
          <Outlet />
        </Suspense>
      </Layout.Content>
    </Layout>
    </AntApp>
  );
}
