/** The permit's travel limits as the clerk records them from the issued permit: they govern the state's travel windows. */
import { Col, Form, Input, InputNumber, Row, Select, Typography } from 'antd';
import { HOLIDAY_NAMES, type HolidayName, type HolidayRule, type PermitTravelTerms } from '@amberline/common';

export type TravelFieldValues = {
  hoursKind?: 'unstated' | 'daylight' | 'clock' | 'any';
  hoursStartOffsetMin?: number;
  hoursEndOffsetMin?: number;
  hoursStart?: string;
  hoursEnd?: string;
  weekendsKind?: 'unstated' | 'allowed' | 'restricted';
  weekendBanDays?: number[];
  holidaysKind?: 'unstated' | 'none' | 'listed';
  holidayNames?: HolidayName[];
  holidayFrom?: HolidayRule['from'];
  holidayObservance?: HolidayRule['observance'];
};

export function travelToFields(t: PermitTravelTerms | undefined): TravelFieldValues {
  const h = t?.hours;
  return {
    hoursKind: h?.kind ?? 'unstated',
    ...(h?.kind === 'daylight' ? { hoursStartOffsetMin: h.startOffsetMin, hoursEndOffsetMin: h.endOffsetMin } : {}),
    ...(h?.kind === 'clock' ? { hoursStart: h.start, hoursEnd: h.end } : {}),
    weekendsKind: t?.weekendBans === undefined ? 'unstated' : t.weekendBans.length ? 'restricted' : 'allowed',
    weekendBanDays: t?.weekendBans?.map((b) => b.day) ?? [],
    holidaysKind: t?.holidays === undefined ? 'unstated' : t.holidays.names.length ? 'listed' : 'none',
    holidayNames: t?.holidays?.names ?? [],
    holidayFrom: t?.holidays?.from ?? 'day-only',
    holidayObservance: t?.holidays?.observance ?? 'actual',
  };
}

/** The structured terms from the form; topics left "not stated" are left out (the rulebook's value stays). Curfews recorded earlier are kept. */
export function fieldsToTravel(v: TravelFieldValues, before: PermitTravelTerms | undefined): PermitTravelTerms | undefined {
  const t: PermitTravelTerms = {};
  if (v.hoursKind === 'daylight') t.hours = { kind: 'daylight', startOffsetMin: v.hoursStartOffsetMin ?? 0, endOffsetMin: v.hoursEndOffsetMin ?? 0 };
  if (v.hoursKind === 'clock') t.hours = { kind: 'clock', start: v.hoursStart ?? '', end: v.hoursEnd ?? '' };
  if (v.hoursKind === 'any') t.hours = { kind: 'any' };
  if (v.weekendsKind === 'allowed') t.weekendBans = [];
  if (v.weekendsKind === 'restricted') t.weekendBans = (v.weekendBanDays ?? []).map((day) => ({ day }));
  if (v.holidaysKind === 'none') t.holidays = { names: [], from: 'day-only', observance: 'actual' };
  if (v.holidaysKind === 'listed') t.holidays = { names: v.holidayNames ?? [], from: v.holidayFrom ?? 'day-only', observance: v.holidayObservance ?? 'actual' };
  if (before?.curfews) t.curfews = before.curfews;
  return Object.keys(t).length ? t : undefined;
}

const DAYS = [
  { value: 6, label: 'Saturday' },
  { value: 0, label: 'Sunday' },
  { value: 5, label: 'Friday' },
];

/** Form fields for hours, weekends and holidays as the permit states them. */
export function PermitTravelFields() {
  const hoursKind = Form.useWatch('hoursKind');
  const weekendsKind = Form.useWatch('weekendsKind');
  const holidaysKind = Form.useWatch('holidaysKind');
  return (
    <div data-testid="permit-travel-fields">
      <Typography.Paragraph type="secondary" style={{ fontSize: 12, marginBottom: 8 }}>
        As the issued permit states them. Once issued, these replace the rulebook for this state in the move’s travel windows and on the driver’s run sheet.
      </Typography.Paragraph>
      <Row gutter={12}>
        <Col span={8}>
          <Form.Item name="hoursKind" label="Travel hours on the permit">
            <Select
              data-testid="permit-hours-kind"
              aria-label="Travel hours on the permit"
              options={[
                { value: 'unstated', label: 'Not stated' },
                { value: 'daylight', label: 'Daylight (from sunrise / to sunset)' },
                { value: 'clock', label: 'Fixed hours' },
                { value: 'any', label: 'Any hour' },
              ]}
            />
          </Form.Item>
        </Col>
        {hoursKind === 'daylight' && (
          <>
            <Col span={8}>
              <Form.Item name="hoursStartOffsetMin" label="Start, min after sunrise (− before)">
                <InputNumber min={-240} max={240} step={15} style={{ width: '100%' }} aria-label="Start, minutes after sunrise" />
              </Form.Item>
            </Col>
            <Col span={8}>
              <Form.Item name="hoursEndOffsetMin" label="End, min after sunset (− before)">
                <InputNumber min={-240} max={240} step={15} style={{ width: '100%' }} aria-label="End, minutes after sunset" />
              </Form.Item>
            </Col>
          </>
        )}
        {hoursKind === 'clock' && (
          <>
            <Col span={8}>
              <Form.Item name="hoursStart" label="From (local, 24-hour)" rules={[{ pattern: /^([01]\d|2[0-3]):[0-5]\d$/, message: 'HH:MM, e.g. 09:00' }]}>
                <Input placeholder="09:00" aria-label="Travel from" />
              </Form.Item>
            </Col>
            <Col span={8}>
              <Form.Item name="hoursEnd" label="To (local, 24-hour)" rules={[{ pattern: /^(([01]\d|2[0-3]):[0-5]\d|24:00)$/, message: 'HH:MM, e.g. 15:30' }]}>
                <Input placeholder="15:30" aria-label="Travel to" />
              </Form.Item>
            </Col>
          </>
        )}
      </Row>
      <Row gutter={12}>
        <Col span={8}>
          <Form.Item name="weekendsKind" label="Weekends on the permit">
            <Select
              data-testid="permit-weekends-kind"
              aria-label="Weekends on the permit"
              options={[
                { value: 'unstated', label: 'Not stated' },
                { value: 'allowed', label: 'Weekend travel allowed' },
                { value: 'restricted', label: 'No travel on some days' },
              ]}
            />
          </Form.Item>
        </Col>
        {weekendsKind === 'restricted' && (
          <Col span={16}>
            <Form.Item name="weekendBanDays" label="No travel on (whole day)">
              <Select mode="multiple" options={DAYS} aria-label="No travel on" />
            </Form.Item>
          </Col>
        )}
      </Row>
      <Row gutter={12}>
        <Col span={8}>
          <Form.Item name="holidaysKind" label="Holidays on the permit">
            <Select
              aria-label="Holidays on the permit"
              options={[
                { value: 'unstated', label: 'Not stated' },
                { value: 'none', label: 'No holiday limit' },
                { value: 'listed', label: 'No travel on listed holidays' },
              ]}
            />
          </Form.Item>
        </Col>
        {holidaysKind === 'listed' && (
          <>
            <Col span={16}>
              <Form.Item name="holidayNames" label="Holidays">
                <Select mode="multiple" options={(Object.keys(HOLIDAY_NAMES) as HolidayName[]).map((n) => ({ value: n, label: HOLIDAY_NAMES[n] }))} aria-label="Holidays" />
              </Form.Item>
            </Col>
            <Col span={12}>
              <Form.Item name="holidayFrom" label="From">
                <Select
                  options={[
                    { value: 'day-only', label: 'The holiday itself' },
                    { value: 'noon-day-before', label: 'Noon the day before' },
                    { value: 'noon-weekday-before', label: 'Noon the weekday before' },
                  ]}
                />
              </Form.Item>
            </Col>
            <Col span={12}>
              <Form.Item name="holidayObservance" label="Date blocked">
                <Select
                  options={[
                    { value: 'actual', label: 'Calendar date' },
                    { value: 'observed', label: 'Observed date' },
                    { value: 'both', label: 'Both' },
                  ]}
                />
              </Form.Item>
            </Col>
          </>
        )}
      </Row>
    </div>
  );
}
