/** Step 3: tractor and trailer, each piece's place on the deck, and the sliding axle with its suggestion. */
import { Alert, Button, Card, Col, Form, Input, InputNumber, Row, Select, Slider, Typography, type FormInstance } from 'antd';
import { formatFeetInches, formatPounds, TRAILER_TYPE_LABELS, type TractorDto, type TrailerDto } from '@amberline/common';
import { feetInchesRule, type MoveDraft } from '../../draft';
import { stepStyle, type FleetList, type InstantAxles, type DraftPiece } from './options';

type Props = {
  hidden: boolean;
  form: FormInstance<MoveDraft>;
  values: MoveDraft;
  tractors: FleetList<TractorDto>;
  trailers: FleetList<TrailerDto>;
  trailer: TrailerDto | undefined;
  pieces: DraftPiece[];
  instant: InstantAxles;
  onTrailerChange: (id: string) => void;
};

export function EquipmentStep({ hidden, form, values, tractors, trailers, trailer, pieces, instant, onTrailerChange }: Props) {
  return (
        <div style={stepStyle(hidden)}>
          <Row gutter={12}>
            <Col xs={24} sm={12}>
              <Form.Item name="tractorId" label="Tractor" rules={[{ required: true, message: 'Pick a tractor' }]}>
                <Select
                  loading={tractors.isPending}
                  showSearch={{ optionFilterProp: 'label' }}
                  options={(tractors.data ?? []).filter((t) => t.active).map((t) => ({ value: t.id, label: `${t.unitNumber} · ${t.plate}` }))}
                  data-testid="f-tractor"
                />
              </Form.Item>
            </Col>
            <Col xs={24} sm={12}>
              <Form.Item name="trailerId" label="Trailer" rules={[{ required: true, message: 'Pick a trailer' }]}>
                <Select
                  loading={trailers.isPending}
                  showSearch={{ optionFilterProp: 'label' }}
                  onChange={onTrailerChange}
                  options={(trailers.data ?? []).filter((t) => t.active).map((t) => ({ value: t.id, label: `${t.unitNumber} · ${TRAILER_TYPE_LABELS[t.type]} ${formatFeetInches(t.lengthIn)}` }))}
                  data-testid="f-trailer"
                />
              </Form.Item>
            </Col>
          </Row>
          {trailer && (
            <Typography.Paragraph type="secondary" style={{ fontSize: 12 }}>
              Decks: {trailer.decks.map((d) => `${d.name} ${formatFeetInches(d.fromFrontIn)}–${formatFeetInches(d.toFrontIn)} from the front at ${formatFeetInches(d.heightIn)}`).join('; ')}. Deck width {formatFeetInches(trailer.widthIn)}.
            </Typography.Paragraph>
          )}
          {(values.articles ?? []).map((a, i) => {
            const p = pieces.find((x) => x.id === (a.id?.trim() || `piece ${i + 1}`));
            const deck =
              p && trailer
                ? trailer.decks.filter((d) => d.fromFrontIn < p.positionFromTrailerFrontIn + p.lengthIn && d.toFrontIn > p.positionFromTrailerFrontIn).sort((x, y) => y.heightIn - x.heightIn)[0]
                : undefined;
            return (
              <Card key={i} size="small" title={`Placement of ${a.id || `piece ${i + 1}`}`} style={{ marginBottom: 12 }}>
                <Row gutter={12}>
                  <Col xs={24} sm={10}>
                    <Form.Item
                      name={['articles', i, 'position']}
                      label="Front of the piece behind the trailer front"
                      rules={[feetInchesRule('position', { signed: true, positive: false })]}
                      extra={deck ? `rests on the ${deck.name} (${formatFeetInches(deck.heightIn)})` : 'a leading minus puts it ahead of the trailer'}
                    >
                      <Input placeholder={`ft' in"`} data-testid={`f-piece-${i}-position`} />
                    </Form.Item>
                  </Col>
                  <Col xs={12} sm={7}>
                    <Form.Item name={['articles', i, 'lateralOffsetIn']} label="Lateral offset" extra="+ toward the curb side" rules={[{ type: 'number', min: -120, max: 120 }]}>
                      <InputNumber style={{ width: '100%' }} suffix="in" />
                    </Form.Item>
                  </Col>
                  <Col xs={12} sm={7}>
                    <Form.Item name={['articles', i, 'dunnageIn']} label="Dunnage" rules={[{ type: 'number', min: 0, max: 48 }]}>
                      <InputNumber style={{ width: '100%' }} suffix="in" min={0} />
                    </Form.Item>
                  </Col>
                </Row>
              </Card>
            );
          })}
          {trailer?.slider ? (
            <Card size="small" title="Sliding axle" data-testid="slider-card">
              <Form.Item name="sliderSettingFt" label="Trailer axle group behind the kingpin (ft)">
                <Slider
                  min={trailer.slider.minFromKingpinFt}
                  max={trailer.slider.maxFromKingpinFt}
                  step={trailer.slider.holeSpacingIn / 12}
                  marks={{ [trailer.slider.minFromKingpinFt]: `${trailer.slider.minFromKingpinFt} ft`, [trailer.slider.maxFromKingpinFt]: `${trailer.slider.maxFromKingpinFt} ft` }}
                  tooltip={{ formatter: (v) => `${Number(v).toFixed(2).replace(/\.?0+$/, '')} ft` }}
                  data-testid="f-slider"
                />
              </Form.Item>
              {instant && (
                <div data-testid="slider-readout">
                  Setting {instant.settingFt.toFixed(2).replace(/\.?0+$/, '')} ft: steer {formatPounds(Math.max(0, instant.steerLb))}, drive {formatPounds(Math.max(0, instant.driveLb))}, trailer group{' '}
                  {formatPounds(Math.max(0, instant.trailerLb))}
                </div>
              )}
              {instant?.suggestion && (
                <Alert
                  style={{ marginTop: 8 }}
                  type={instant.suggestion.found ? 'info' : 'warning'}
                  showIcon
                  data-testid="slider-suggestion"
                  title={instant.suggestion.found ? `Suggested: ${instant.suggestion.best!.axleGroupFromKingpinFt} ft` : 'No legal setting'}
                  description={instant.suggestion.message}
                  action={
                    instant.suggestion.found && (
                      <Button size="small" onClick={() => form.setFieldValue('sliderSettingFt', instant.suggestion!.best!.axleGroupFromKingpinFt)} data-testid="use-suggestion">
                        Use it
                      </Button>
                    )
                  }
                />
              )}
            </Card>
          ) : (
            trailer && (
              <Typography.Paragraph type="secondary">
                This trailer's axles do not slide: the group sits {trailer.axleGroupFromKingpinFt} ft behind the kingpin.
              </Typography.Paragraph>
            )
          )}
        </div>
  );
}
