import { useState } from 'react';
import { Alert, App, Button, InputNumber, Space, Spin, Table, Tag, Typography } from 'antd';
import type { MoveDto, ScheduleDay } from '@amberline/common';
import { ApiError } from '../../../lib/api-client';
import { calendarDate } from '../../../lib/time';
import { useSchedule } from '../api/get-schedule';
import { useUpdateMove } from '../api/update-move';

/**
 * The day plan as a timeline (which state on which day, and how far), with every date that does not agree: a day
 * without a legal window, a permit that does not cover a day's window, escorts confirmed for other dates. The
 * dispatcher sets the daily distance here.
 */
export function ScheduleTimeline({ move, canEdit }: { move: MoveDto; canEdit: boolean }) {
  const { message } = App.useApp();
  const schedule = useSchedule(move.id);
  const update = useUpdateMove();
  const [miles, setMiles] = useState<number | null>(null);
  if (schedule.isPending) return <Spin />;
  if (schedule.isError) return <Alert type="error" showIcon title={`Schedule not available: ${schedule.error.message}`} />;
  const s = schedule.data;
  const save = (value: number | null) =>
    update.mutate(
      { id: move.id, version: move.version, dailyMiles: value },
      {
        onSuccess: () => (setMiles(null), message.success(value === null ? 'Daily distance: the route over the travel days' : `Daily distance set to ${value} mi`)),
        onError: (e) => message.error(e instanceof ApiError && e.fieldErrors().length ? e.fieldErrors().map((f) => f.errors.join(', ')).join('; ') : e.message),
      },
    );
  const general = s.findings.filter((f) => f.date === null);
  return (
    <div data-testid="schedule">
      <Space wrap style={{ marginBottom: 8 }}>
        <Typography.Text>
          Daily distance: <strong>{s.plan.dailyMiles} mi</strong> {s.dailyMilesSet ? '(set by the dispatcher)' : '(the route’s miles over the travel days)'} · {Math.round(s.plan.totalMiles)} mi in{' '}
          {s.plan.daysNeeded} day{s.plan.daysNeeded === 1 ? '' : 's'} of {s.plan.days.length} planned
        </Typography.Text>
        {canEdit && (
          <>
            <InputNumber min={20} max={1000} step={10} value={miles ?? s.plan.dailyMiles} onChange={(v) => setMiles(v)} suffix="mi/day" aria-label="Daily distance" data-testid="daily-miles" style={{ width: 140 }} />
            <Button onClick={() => save(miles ?? s.plan.dailyMiles)} loading={update.isPending} disabled={miles === null} data-testid="daily-miles-save">
              Set
            </Button>
            {s.dailyMilesSet && (
              <Button type="link" onClick={() => save(null)}>
                Spread over the travel days
              </Button>
            )}
          </>
        )}
      </Space>
      {general.map((f) => (
        <Alert key={f.message} type="error" showIcon style={{ marginBottom: 8 }} title={f.message} />
      ))}
      <Table<ScheduleDay>
        size="small"
        rowKey="date"
        pagination={false}
        scroll={{ x: 'max-content' }}
        dataSource={s.days}
        columns={[
          { title: 'Day', dataIndex: 'date', width: 150, render: (d: string) => calendarDate(d) },
          {
            title: 'States and miles',
            render: (_, d) => (d.states.length ? d.states.map((x) => <Tag key={x.jurisdiction}>{`${x.jurisdiction} ${x.miles} mi`}</Tag>) : <Typography.Text type="secondary">no driving (arrived)</Typography.Text>),
          },
          {
            title: 'Dates agree?',
            render: (_, d) =>
              d.findings.length === 0 ? (
                <Tag color="green">windows, permits and escorts agree</Tag>
              ) : (
                <ul style={{ margin: 0, paddingLeft: 18 }} data-testid="schedule-findings">
                  {d.findings.map((f) => (
                    <li key={f.message}>
                      <Typography.Text type={f.blocking ? 'danger' : 'warning'}>{f.message}</Typography.Text>
                    </li>
                  ))}
                </ul>
              ),
          },
        ]}
      />
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, marginTop: 6 }}>
        A planning figure: hours of service, curfews and the permits&apos; own hours decide how far the load really goes each day. Missing permits and escorts are listed by their own
        sections; this checks the dates of what is recorded. The run cannot start while a date here disagrees.
      </Typography.Paragraph>
    </div>
  );
}
