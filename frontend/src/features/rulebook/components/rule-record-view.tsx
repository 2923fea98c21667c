/** Every value of a rule record with its source and as-of date beside it. */
import type { ReactNode } from 'react';
import { Card, Table, Typography } from 'antd';
import {
  formatFeetInches,
  formatPounds,
  formatUsd,
  MEASURE_LABELS,
  type JurisdictionRule,
  type RuleSource,
  type Trigger,
} from '@amberline/common';
import { RuleSourceNote } from '../../../components/rule-source';

const ft = (v: number | null | undefined) => (v === null || v === undefined ? 'none' : formatFeetInches(v));
const trig = (t: Trigger) => {
  const v = t.over ?? t.atLeast ?? 0;
  const shown = t.measure === 'gross' ? formatPounds(v) : formatFeetInches(v);
  return `${MEASURE_LABELS[t.measure]} ${t.over !== undefined ? 'over' : 'at least'} ${shown}`;
};
const HOLIDAY_LABELS: Record<string, string> = {
  'new-years-day': "New Year's Day",
  'mlk-day': 'Martin Luther King Jr. Day',
  'washingtons-birthday': "Washington's Birthday",
  'memorial-day': 'Memorial Day',
  juneteenth: 'Juneteenth',
  'independence-day': 'Independence Day',
  'labor-day': 'Labor Day',
  'columbus-day': 'Columbus Day',
  'veterans-day': 'Veterans Day',
  thanksgiving: 'Thanksgiving',
  'day-after-thanksgiving': 'Day after Thanksgiving',
  'christmas-eve': 'Christmas Eve',
  christmas: 'Christmas Day',
};
const DAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

type Row = { key: string; label: string; value: ReactNode; source: RuleSource | null };

function Rows({ rows, testId }: { rows: Row[]; testId?: string }) {
  return (
    <Table<Row>
      size="small"
      showHeader={false}
      pagination={false}
      rowKey="key"
      dataSource={rows}
      data-testid={testId}
      columns={[
        { dataIndex: 'label', width: '32%', render: (l: string) => <Typography.Text strong>{l}</Typography.Text> },
        { dataIndex: 'value', width: '33%' },
        { dataIndex: 'source', render: (s: RuleSource | null) => (s ? <RuleSourceNote source={s} /> : null) },
      ]}
    />
  );
}

export function RuleRecordView({ record: r }: { record: JurisdictionRule }) {
  const L = r.legal;
  const ds = L.dimensionSources;
  const T = r.travel;
  const F = r.fee;
  const card = (title: string, children: ReactNode) => (
    <Card size="small" title={title} style={{ marginBottom: 12 }}>
      {children}
    </Card>
  );
  return (
    <div data-testid="rule-record">
      {card(
        'Legal limits',
        <Rows
          testId="rule-legal"
          rows={[
            { key: 'w', label: 'Width', value: ft(L.widthIn), source: ds.width },
            { key: 'h', label: 'Height', value: ft(L.heightIn), source: ds.height },
            { key: 'l', label: 'Length', value: ft(L.lengthIn), source: ds.length },
            { key: 'fo', label: 'Front overhang', value: ft(L.frontOverhangIn), source: ds.overhangs },
            { key: 'ro', label: 'Rear overhang', value: ft(L.rearOverhangIn), source: ds.overhangs },
            { key: 's', label: 'Single axle', value: formatPounds(L.singleAxleLb), source: L.source },
            { key: 't', label: 'Tandem', value: formatPounds(L.tandemLb), source: L.source },
            { key: 'g', label: 'Gross', value: formatPounds(L.grossLb), source: L.source },
            {
              key: 'b',
              label: 'Bridge formula',
              value: `${L.bridgeFormula ? 'applies' : 'does not apply'}; ties round ${L.bridgeTie}${L.tandemPairMinFt !== null ? `; two tandems ${L.tandemPairMinFt} ft apart carry a tandem each` : ''}`,
              source: L.source,
            },
          ]}
        />,
      )}
      {card(
        'Permit',
        <Rows
          rows={[
            { key: 'v', label: 'Valid for', value: `${r.permit.validityDays} days`, source: r.permit.source },
            { key: 'lt', label: 'Apply ahead', value: `${r.permit.leadTimeDays} days`, source: r.permit.source },
          ]}
        />,
      )}
      {card(
        'Escorts',
        <>
          {r.escorts.rules.length === 0 ? (
            <Typography.Paragraph type="secondary">No escort thresholds in this record.</Typography.Paragraph>
          ) : (
            <Rows
              testId="rule-escorts"
              rows={r.escorts.rules.map((e, i) => ({
                key: `e${i}`,
                label: `${trig(e.when)} on ${e.roads.join(', ')}`,
                value: `${e.front} front, ${e.rear} rear${e.heightPole ? ', height pole' : ''}`,
                source: e.source,
              }))}
            />
          )}
          <Rows
            rows={[
              ...(r.escorts.twoDimensionRule
                ? [
                    {
                      key: 'two',
                      label: 'Over escort limits in two dimensions',
                      value: `front and rear escorts${r.escorts.twoDimensionRule.exceptPairs.length ? `, except ${r.escorts.twoDimensionRule.exceptPairs.map(([a, b]) => `${MEASURE_LABELS[a]} + ${MEASURE_LABELS[b]}`).join('; ')}` : ''}`,
                      source: r.escorts.twoDimensionRule.source,
                    },
                  ]
                : []),
              ...(r.escorts.heightPole ? [{ key: 'hp', label: 'Height pole', value: `set ${formatFeetInches(r.escorts.heightPole.marginIn)} above the load`, source: r.escorts.heightPole.source }] : []),
            ]}
          />
        </>,
      )}
      {card(
        'Signs, flags and lamps',
        <Rows
          rows={[
            ...r.signs.map((s, i) => ({
              key: `s${i}`,
              label: `“${s.text}” sign${s.whenOversize ? ' when oversize' : ''}${s.when.length ? ` / ${s.when.map(trig).join(' or ')}` : ''}`,
              value: `${s.minWidthIn}×${s.minHeightIn} in, ${s.letterHeightIn} in letters${s.strokeIn ? `, ${s.strokeIn} in stroke` : ''}, ${s.colors}; ${s.positions.join(', ')}${s.escortSign ? `; escort vehicles ${s.escortSign.minWidthIn}×${s.escortSign.minHeightIn} in` : ''}`,
              source: s.source,
            })),
            ...r.flags.map((f, i) => ({
              key: `f${i}`,
              label: `${f.kind} flags${f.whenOversize ? ' when oversize' : ''}${f.when.length ? ` / ${f.when.map(trig).join(' or ')}` : ''}`,
              value: `${f.minCount}${f.maxCount ? `–${f.maxCount}` : ''} flags, ${f.minSquareIn} in square, ${f.colors}`,
              source: f.source,
            })),
            ...r.lamps.map((l, i) => ({
              key: `l${i}`,
              label: `Lamps ${l.note ?? ''} / ${l.when.map(trig).join(' or ')}`,
              value: l.lamps.map((x) => `${x.count} ${x.color} at ${x.position}`).join('; '),
              source: l.source,
            })),
          ]}
        />,
      )}
      {card(
        'Travel',
        <Rows
          testId="rule-travel"
          rows={[
            {
              key: 'd',
              label: 'Daylight',
              value: T.daylight ? `from ${Math.abs(T.daylight.startOffsetMin)} min ${T.daylight.startOffsetMin < 0 ? 'before' : 'after'} sunrise to ${Math.abs(T.daylight.endOffsetMin)} min ${T.daylight.endOffsetMin < 0 ? 'before' : 'after'} sunset` : 'no daylight-only rule',
              source: T.daylight?.source ?? null,
            },
            { key: 'w', label: 'Weekends', value: T.weekends.allowed ? 'travel allowed' : 'no travel', source: T.weekends.source },
            {
              key: 'h',
              label: 'Holidays',
              value: T.holidays.names.length
                ? `${T.holidays.names.map((n) => HOLIDAY_LABELS[n] ?? n).join(', ')}; from ${T.holidays.from.replace(/-/g, ' ')}; ${T.holidays.observance} date`
                : 'none',
              source: T.holidays.source,
            },
            ...T.curfews.map((c, i) => ({
              key: `c${i}`,
              label: `Curfew ${c.appliesIn === 'urban' ? 'in town' : 'everywhere'}`,
              value: `${c.start}–${c.end}${c.days ? ` on ${c.days.map((d) => DAYS[d]).join(', ')}` : ''}${c.exempt?.overweightOnly ? '; overweight-only loads exempt' : ''}${c.exempt?.overlengthOnlyMaxIn ? `; overlength-only up to ${formatFeetInches(c.exempt.overlengthOnlyMaxIn)} exempt` : ''}`,
              source: c.source,
            })),
            ...(T.minVisibilityFt ? [{ key: 'v', label: 'Visibility', value: `no movement under ${T.minVisibilityFt.value} ft`, source: T.minVisibilityFt.source }] : []),
          ]}
        />,
      )}
      {card(
        'Fee',
        <Rows
          testId="rule-fee"
          rows={[
            { key: 'b', label: 'Base', value: formatUsd(F.baseUsd), source: F.source },
            ...(F.widthTiers ?? []).map((t, i) => ({ key: `wt${i}`, label: `Width ${t.upToIn ? `up to ${ft(t.upToIn)}` : 'above'}`, value: formatUsd(t.feeUsd), source: F.source })),
            ...(F.dimensionTiers ?? []).map((t, i) => ({
              key: `dt${i}`,
              label: `Up to ${[t.maxWidthIn && `${ft(t.maxWidthIn)} wide`, t.maxHeightIn && `${ft(t.maxHeightIn)} high`, t.maxLengthIn && `${ft(t.maxLengthIn)} long`].filter(Boolean).join(', ') || 'any size'}`,
              value: formatUsd(t.feeUsd),
              source: F.source,
            })),
            ...(F.weightBrackets ?? []).map((b, i) => ({ key: `wb${i}`, label: `Gross over ${formatPounds(b.overLb)}${b.upToLb ? ` up to ${formatPounds(b.upToLb)}` : ''}`, value: formatUsd(b.feeUsd), source: F.source })),
            ...(F.tonMile
              ? [{ key: 'tm', label: 'Per ton-mile', value: `${formatUsd(F.tonMile.usdPerTonMile)}${F.tonMile.overLb ? ` over ${formatPounds(F.tonMile.overLb)}` : ''}${F.tonMile.overRegisteredGross ? ' over the registered gross' : ''}`, source: F.source }]
              : []),
            ...(F.addOns ?? []).map((a, i) => ({ key: `ao${i}`, label: a.label, value: `${formatUsd(a.feeUsd)}${a.when && a.when !== 'always' ? ` (${a.when})` : ''}`, source: F.source })),
            { key: 'r', label: 'Refundable', value: F.refundable ? 'yes' : 'no', source: F.source },
          ]}
        />,
      )}
      {card(
        'Superload',
        <Rows
          rows={[
            { key: 'w', label: 'Width over', value: ft(r.superload.widthOverIn), source: r.superload.source },
            { key: 'h', label: 'Height over', value: ft(r.superload.heightOverIn), source: r.superload.source },
            { key: 'l', label: 'Length over', value: ft(r.superload.lengthOverIn), source: r.superload.source },
            { key: 'g', label: 'Gross over', value: r.superload.grossOverLb ? formatPounds(r.superload.grossOverLb) : 'none', source: r.superload.source },
          ]}
        />,
      )}
    </div>
  );
}
