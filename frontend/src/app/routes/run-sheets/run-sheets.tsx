import { Alert, Empty, Typography } from 'antd';
import { PageSpinner } from '../../../components/page-spinner';
import { RunSheetCard } from '../../../features/run-sheets/components/run-sheet-card';
import { useRunSheetMoves } from '../../../features/run-sheets/api/get-run-sheet-moves';
import { useAuth } from '../../../lib/auth';

/** A driver's assigned moves, next departure first; the office sees the moves ready to leave or on the road. */
export function RunSheetsPage() {
  const { user } = useAuth();
  const office = user?.role !== 'driver';
  const { open, done, isPending, error } = useRunSheetMoves(user?.role);
  if (isPending) return <PageSpinner />;
  return (
    <div style={{ maxWidth: 720, margin: '0 auto' }} data-testid="run-sheets-page">
      <Typography.Title level={3} style={{ marginTop: 0 }}>
        Run sheets
      </Typography.Title>
      <Typography.Paragraph type="secondary">
        {office ? 'Moves with permits received, escorts booked or running.' : 'Your assigned moves. Open one to read its run sheet, record the departure checks and acknowledge it.'}
      </Typography.Paragraph>
      {error && <Alert type="error" showIcon title={error.message} style={{ marginBottom: 12 }} />}
      {open.length === 0 && done.length === 0 && !error && <Empty description={office ? 'No moves at these stages.' : 'No moves are assigned to you.'} />}
      {open.map((m, i) => (
        <RunSheetCard key={m.id} move={m} next={!office && i === 0} showDriver={office} />
      ))}
      {done.length > 0 && (
        <>
          <Typography.Title level={5}>Earlier moves</Typography.Title>
          {done.map((m) => (
            <RunSheetCard key={m.id} move={m} showDriver={office} />
          ))}
        </>
      )}
    </div>
  );
}
