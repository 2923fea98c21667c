import { Alert, Typography } from 'antd';
import type { RunSheetDto, TravelWindowsResult } from '@amberline/common';
import { CitedSource, NotOnFile } from '../../../components/rule-source';
import { calendarDate, localClock, localInstant, minutesOf } from '../format';
import { INFO_STYLE } from './section';

const DAY = 24 * 60;
const pct = (min: number) => `${(Math.max(0, Math.min(DAY, min)) / DAY) * 100}%`;

/** One day's 24 h bar: allowed intervals shaded, sunrise and sunset marked. */
function DayBar({ day }: { day: TravelWindowsResult }) {
  const rise = minutesOf(localClock(day.sunrise, day.timeZone));
  const set = minutesOf(localClock(day.sunset, day.timeZone));
  return (
    <div>
      <div
        style={{ position: 'relative', height: 22, background: day.allowed ? '#f1f5f9' : '#fee2e2', border: '1px solid #cbd5e1', borderRadius: 3, overflow: 'hidden' }}
        role="img"
        aria-label={day.allowed ? `Allowed ${day.intervals.map((i) => `${i.startLocal} to ${i.endLocal}`).join(', ')}` : 'No travel allowed'}
        data-testid="travel-bar"
      >
        {[6, 12, 18].map((h) => (
          <div key={h} style={{ position: 'absolute', left: pct(h * 60), top: 0, bottom: 0, borderLeft: '1px dashed #cbd5e1' }} />
        ))}
        {day.intervals.map((iv) => {
          const a = minutesOf(iv.startLocal) ?? 0;
          let b = minutesOf(iv.endLocal) ?? DAY;
          if (b <= a) b = DAY;
          return (
            <div
              key={iv.start}
              data-testid="travel-interval"
              style={{ position: 'absolute', left: pct(a), width: `calc(${pct(b)} - ${pct(a)})`, top: 2, bottom: 2, background: '#16a34a', borderRadius: 2, WebkitPrintColorAdjust: 'exact', printColorAdjust: 'exact' }}
            />
          );
        })}
        {rise !== null && <div title={`sunrise ${localClock(day.sunrise, day.timeZone)}`} style={{ position: 'absolute', left: pct(rise), top: 0, bottom: 0, borderLeft: '2px solid #f59e0b' }} />}
        {set !== null && <div title={`sunset ${localClock(day.sunset, day.timeZone)}`} style={{ position: 'absolute', left: pct(set), top: 0, bottom: 0, borderLeft: '2px solid #7c3aed' }} />}
      </div>
      <div style={{ position: 'relative', height: 14, fontSize: 10, color: '#64748b' }}>
        {[0, 6, 12, 18, 24].map((h) => (
          <span key={h} style={{ position: 'absolute', left: pct(h * 60), transform: h === 0 ? 'none' : h === 24 ? 'translateX(-100%)' : 'translateX(-50%)' }}>
            {String(h).padStart(2, '0')}
          </span>
        ))}
      </div>
    </div>
  );
}

export function TravelTimeline({ sheet }: { sheet: RunSheetDto }) {
  const firstZone = sheet.move.route.slice().sort((a, b) => a.order - b.order)[0]?.timeZone;
  return (
    <div data-testid="travel-timeline">
      {sheet.earliestDeparture ? (
        <Alert
          type="info"
          showIcon
          style={{ marginBottom: 10, ...INFO_STYLE }}
          title={
            <span data-testid="earliest-departure">
              Earliest legal departure: <strong>{localInstant(sheet.earliestDeparture, firstZone)}</strong>
              {!sheet.earliestDepartureKnown && <NotOnFile>travel rules of the first state not on file — check the permit</NotOnFile>}
            </span>
          }
        />
      ) : (
        <Alert type="error" showIcon style={{ marginBottom: 10 }} title="No legal travel window on the planned dates: call your dispatcher before leaving." data-testid="earliest-departure" />
      )}
      <Typography.Paragraph type="secondary" style={{ fontSize: 12 }}>
        Green: allowed travel in local time. Orange line: sunrise; purple line: sunset. The permit&apos;s own hours govern.
      </Typography.Paragraph>
      {sheet.travel.map((j) => (
        <div key={j.jurisdiction} style={{ marginBottom: 12 }} data-testid={`travel-${j.jurisdiction}`}>
          <Typography.Text strong>
            {j.name} ({j.jurisdiction})
          </Typography.Text>
          {j.days.map((day) => (
            <div key={day.date} style={{ marginTop: 6, paddingTop: 6, borderTop: '1px solid #f1f5f9' }}>
              <div style={{ display: 'flex', justifyContent: 'space-between', gap: 8, flexWrap: 'wrap', fontSize: 13 }}>
                <span style={{ fontWeight: 600 }}>{calendarDate(day.date)}</span>
                <span>
                  {!day.known && <NotOnFile>{day.unknownTopics.join(', ')}: not on file — check the permit</NotOnFile>}{' '}
                  {day.allowed && day.intervals.length ? (
                    day.intervals.map((i) => `${i.startLocal}–${i.endLocal}`).join(', ')
                  ) : (
                    <Typography.Text type="danger" strong>
                      no travel
                    </Typography.Text>
                  )}
                </span>
              </div>
              <DayBar day={day} />
              {(day.sunrise || day.sunset) && (
                <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                  Sunrise {localClock(day.sunrise, day.timeZone) ?? '—'} · sunset {localClock(day.sunset, day.timeZone) ?? '—'} ({day.timeZone})
                </Typography.Text>
              )}
              {day.restrictions.length > 0 && (
                <ul style={{ margin: '4px 0 0', paddingInlineStart: 18, fontSize: 13 }} data-testid="travel-restrictions">
                  {day.restrictions.map((r, k) => (
                    <li key={k}>
                      {r.message} <CitedSource text={r.source} />
                    </li>
                  ))}
                </ul>
              )}
            </div>
          ))}
        </div>
      ))}
    </div>
  );
}
