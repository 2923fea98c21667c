import { Typography } from 'antd';
import { TRAILER_TYPE_LABELS, type RunSheetDto, type TrailerType } from '@amberline/common';
import { StageTag } from '../../../components/stage-tag';
import { calendarDate } from '../format';
import { Fact, Facts } from './section';

export function RunSheetHeader({ sheet }: { sheet: RunSheetDto }) {
  const m = sheet.move;
  const dates = m.travelDates.length > 1 ? `${calendarDate(m.travelDates[0])} – ${calendarDate(m.travelDates[m.travelDates.length - 1])}` : calendarDate(m.requestedDeparture);
  const trailerType = TRAILER_TYPE_LABELS[m.trailer.type as TrailerType] ?? m.trailer.type.replace(/_/g, ' ');
  return (
    <header style={{ marginBottom: 12 }}>
      <div style={{ display: 'flex', alignItems: 'center', gap: 8, flexWrap: 'wrap' }}>
        <Typography.Title level={3} style={{ margin: 0 }} data-testid="run-sheet-reference">
          Run sheet {m.reference}
        </Typography.Title>
        <StageTag stage={m.stage} />
      </div>
      <Typography.Paragraph type="secondary" style={{ margin: '2px 0 10px' }}>
        {m.origin} → {m.destination}
      </Typography.Paragraph>
      <Facts>
        <Fact label="Customer">
          {m.customer}
          {m.customerRef ? ` · ${m.customerRef}` : ''}
        </Fact>
        <Fact label="Commodity">{m.commodity}</Fact>
        <Fact label="Travel dates">{dates}</Fact>
        <Fact label="Tractor">{m.tractor.unitNumber}</Fact>
        <Fact label="Trailer">
          {m.trailer.unitNumber} ({trailerType})
        </Fact>
        <Fact label="Driver">{m.driver?.name ?? 'not assigned'}</Fact>
      </Facts>
      <Typography.Text type="secondary" style={{ fontSize: 11, display: 'block', marginTop: 6 }}>
        Sheet version {sheet.fingerprint.slice(0, 12)} · generated {new Date(sheet.generatedAt).toLocaleString('en-US')}
      </Typography.Text>
    </header>
  );
}
