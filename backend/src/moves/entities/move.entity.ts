import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { MoveArticle, MoveStage, RouteSegmentDto } from '@amberline/common';
import { Tractor } from '../../fleet/entities/tractor.entity';
import { Trailer } from '../../fleet/entities/trailer.entity';
import { User } from '../../users/entities/user.entity';

/** What the list shows without recomputing: the last assessment's headline figures. */
export type MoveSummary = { permitsNeeded: string[]; escorts: number; superload: boolean; overweight: boolean; problems: string[]; estimatedFeesUsd: number };

const numeric = { to: (v: number | null) => v, from: (v: string | null) => (v === null ? null : Number(v)) };

@Entity({ name: 'moves' })
export class Move {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 20 }) reference: string;
  @Column({ type: 'varchar', length: 120 }) customer: string;
  @Column({ name: 'customer_ref', type: 'varchar', length: 60, nullable: true }) customerRef: string | null;
  @Column({ type: 'varchar', length: 200 }) commodity: string;
  @Column({ type: 'varchar', length: 20, default: 'requested' }) stage: MoveStage;
  @Column({ name: 'tractor_id', type: 'uuid' }) tractorId: string;
  @ManyToOne(() => Tractor) @JoinColumn({ name: 'tractor_id' }) tractor?: Tractor;
  @Column({ name: 'trailer_id', type: 'uuid' }) trailerId: string;
  @ManyToOne(() => Trailer) @JoinColumn({ name: 'trailer_id' }) trailer?: Trailer;
  @Column({ name: 'driver_id', type: 'uuid', nullable: true }) driverId: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'driver_id' }) driver?: User | null;
  @Column({ name: 'slider_setting_ft', type: 'numeric', precision: 6, scale: 2, nullable: true, transformer: numeric }) sliderSettingFt: number | null;
  @Column({ type: 'jsonb' }) articles: MoveArticle[];
  @Column({ type: 'jsonb' }) route: RouteSegmentDto[];
  @Column({ type: 'varchar', length: 2, array: true }) jurisdictions: string[];
  @Column({ type: 'varchar', length: 200 }) origin: string;
  @Column({ type: 'varchar', length: 200 }) destination: string;
  @Column({ name: 'requested_departure', type: 'date' }) requestedDeparture: string;
  @Column({ name: 'travel_days', type: 'int', default: 1 }) travelDays: number;
  /** Miles a day for the day plan (null = the route spread over the travel days). */
  @Column({ name: 'daily_miles', type: 'int', nullable: true }) dailyMiles: number | null;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  @Column({ type: 'jsonb', default: () => `'{}'::jsonb` }) summary: MoveSummary;
  /** Goes up whenever dimensions, weights, equipment or route change: permits and run sheets compare it. */
  @Column({ name: 'plan_revision', type: 'int', default: 1 }) planRevision: number;
  @Column({ type: 'int', default: 1 }) version: number;
  /** The rule versions the assessment keeps once the move has left `requested` (null while requested). */
  @Column({ name: 'rule_versions', type: 'jsonb', nullable: true }) ruleVersions: Record<string, number> | null;
  @Column({ name: 'stage_changed_at', type: 'timestamptz', nullable: true }) stageChangedAt: Date | null;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdById: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
