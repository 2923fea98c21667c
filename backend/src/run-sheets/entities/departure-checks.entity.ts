import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { CheckFinding, ChecksOverride, DepartureChecksDto, GaugeReading, ScaleWeight } from '@amberline/common';
import { User } from '../../users/entities/user.entity';

const numeric = { to: (v: number) => v, from: (v: string) => Number(v) };

@Entity({ name: 'departure_checks' })
export class DepartureChecks {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'move_id', type: 'uuid' }) moveId: string;
  @Column({ name: 'driver_id', type: 'uuid' }) driverId: string;
  @ManyToOne(() => User) @JoinColumn({ name: 'driver_id' }) driver?: User;
  @Column({ type: 'varchar', length: 64 }) fingerprint: string;
  @Column({ name: 'measured_height_in', type: 'numeric', transformer: numeric }) measuredHeightIn: number;
  @Column({ name: 'measured_width_in', type: 'numeric', transformer: numeric }) measuredWidthIn: number;
  @Column({ name: 'measured_length_in', type: 'numeric', transformer: numeric }) measuredLengthIn: number;
  @Column({ name: 'slider_pins_locked', type: 'boolean' }) sliderPinsLocked: boolean;
  @Column({ name: 'tires_inflated', type: 'boolean' }) tiresInflated: boolean;
  @Column({ name: 'markings_in_place', type: 'boolean' }) markingsInPlace: boolean;
  @Column({ name: 'permits_on_board', type: 'boolean' }) permitsOnBoard: boolean;
  @Column({ name: 'gauge_readings', type: 'jsonb' }) gaugeReadings: GaugeReading[];
  @Column({ name: 'gauge_estimates', type: 'jsonb' }) gaugeEstimates: DepartureChecksDto['gaugeEstimates'];
  @Column({ name: 'scale_weights', type: 'jsonb', default: () => `'[]'::jsonb` }) scaleWeights: ScaleWeight[];
  @Column({ type: 'jsonb' }) findings: CheckFinding[];
  /** Set when a dispatcher let checks blocked only by gauge findings pass, with the reason. */
  @Column({ type: 'jsonb', nullable: true }) override: ChecksOverride | null;
  @Column({ type: 'varchar', length: 10 }) outcome: 'passed' | 'blocked';
  @Column({ name: 'submitted_at', type: 'timestamptz', default: () => 'now()' }) submittedAt: Date;
}
