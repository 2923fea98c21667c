import { Alert, Card, Typography } from 'antd';
import { Navigate } from 'react-router-dom';
import type { Role } from '@amberline/common';
import { paths } from '../../config/paths';
import { useAuth } from '../../lib/auth';

const ROLE_SUMMARY: Record<Role, string> = {
  admin: 'Keep users, the fleet and the per-state rulebook up to date.',
  dispatcher: 'Open moves for wide and heavy loads, read their assessments, book escorts and follow each move by stage.',
  permit_clerk: 'Work the permit desk: file with each state, record numbers and validity, attach the permit PDF and pay the fee.',
  driver: 'Open the run sheet for your assigned moves, record the departure checks and acknowledge the sheet.',
};

export function HomePage() {
  const { user } = useAuth();
  if (!user) return null;
  // a driver's work starts on the run sheets
  if (user.role === 'driver') return <Navigate to={paths.runSheets} replace />;
  return (
    <div style={{ maxWidth: 900 }}>
      <Typography.Title level={2}>Good to see you, {user.name.split(' ')[0]}</Typography.Title>
      <Card>
        <Typography.Paragraph data-testid="role-summary">{ROLE_SUMMARY[user.role]}</Typography.Paragraph>
      </Card>
      <Alert
        style={{ marginTop: 16 }}
        type="warning"
        showIcon
        title="Planning aid"
        description="Amberline's figures help plan a move. The permit, a certified scale, posted signs and each state's current rules govern."
      />
    </div>
  );
}
