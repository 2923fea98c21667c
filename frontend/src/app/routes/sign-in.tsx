import { useState } from 'react';
import { Alert, Button, Card, Form, Input, Typography } from 'antd';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import type { LoginRequest } from '@amberline/common';
import { BrandMark } from '../../components/brand-mark';
import { paths } from '../../config/paths';
import { ApiError } from '../../lib/api-client';
import { useAuth } from '../../lib/auth';
import { palette } from '../theme';

export function SignInPage() {
  const { user, signIn } = useAuth();
  const navigate = useNavigate();
  const location = useLocation();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  if (user) return <Navigate to={paths.home} replace />;

  const onFinish = async (values: LoginRequest) => {
    setBusy(true);
    setError(null);
    try {
      await signIn(values);
      navigate((location.state as { from?: string } | null)?.from ?? paths.home, { replace: true });
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach the server');
    } finally {
      setBusy(false);
    }
  };

  return (
    <div style={{ minHeight: '100vh', display: 'grid', placeItems: 'center', background: palette.slate900, padding: 16 }}>
      <Card style={{ width: '100%', maxWidth: 380 }}>
        <div style={{ display: 'flex', alignItems: 'center', gap: 10, marginBottom: 8 }}>
          <BrandMark size={36} />
          <Typography.Title level={3} style={{ margin: 0 }}>
            Amberline
          </Typography.Title>
        </div>
        <Typography.Paragraph type="secondary">The move desk for oversize and overweight loads.</Typography.Paragraph>
        {error && <Alert type="error" showIcon title={error} style={{ marginBottom: 16 }} data-testid="sign-in-error" />}
        <Form layout="vertical" onFinish={onFinish} requiredMark={false}>
          <Form.Item label="E-mail" name="email" rules={[{ required: true, message: 'Enter your e-mail' }]}>
            <Input autoComplete="username" autoFocus />
          </Form.Item>
          <Form.Item label="Password" name="password" rules={[{ required: true, message: 'Enter your password' }]}>
            <Input.Password autoComplete="current-password" />
          </Form.Item>
          <Button type="primary" htmlType="submit" block loading={busy}>
            Sign in
          </Button>
        </Form>
      </Card>
    </div>
  );
}
