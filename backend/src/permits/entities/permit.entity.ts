import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { PermitConditions, PermitStatus, PermitType, PermittedFacts } from '@amberline/common';
import { Move } from '../../moves/entities/move.entity';
import { User } from '../../users/entities/user.entity';

/** The stored expression of `urgency_group` (as the migration wrote it). */
export const URGENCY_GROUP_SQL = `CASE WHEN status IN ('issued','void') THEN 1 ELSE 0 END`;

/** One jurisdiction's permit for one move. */
@Entity({ name: 'permits' })
export class Permit {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'move_id', type: 'uuid' }) moveId: string;
  @ManyToOne(() => Move) @JoinColumn({ name: 'move_id' }) move?: Move;
  @Column({ type: 'varchar', length: 2 }) jurisdiction: string;
  @Column({ name: 'permit_type', type: 'varchar', length: 20, default: 'single_trip' }) permitType: PermitType;
  @Column({ type: 'varchar', length: 20, default: 'to_file' }) status: PermitStatus;
  /** False when the current assessment no longer asks for a permit here. */
  @Column({ type: 'boolean', default: true }) needed: boolean;
  @Column({ name: 'permit_number', type: 'varchar', length: 60, nullable: true }) permitNumber: string | null;
  @Column({ name: 'filed_at', type: 'timestamptz', nullable: true }) filedAt: Date | null;
  @Column({ name: 'issued_at', type: 'timestamptz', nullable: true }) issuedAt: Date | null;
  @Column({ name: 'valid_from', type: 'timestamptz', nullable: true }) validFrom: Date | null;
  @Column({ name: 'valid_to', type: 'timestamptz', nullable: true }) validTo: Date | null;
  @Column({ type: 'jsonb', nullable: true }) permitted: PermittedFacts | null;
  @Column({ name: 'route_text', type: 'text', nullable: true }) routeText: string | null;
  @Column({ type: 'jsonb', default: () => `'{}'::jsonb` }) conditions: PermitConditions;
  @Column({ name: 'conditions_text', type: 'text', nullable: true }) conditionsText: string | null;
  @Column({ name: 'estimated_fee_cents', type: 'int', nullable: true }) estimatedFeeCents: number | null;
  @Column({ name: 'actual_fee_cents', type: 'int', nullable: true }) actualFeeCents: number | null;
  @Column({ type: 'boolean', nullable: true }) refundable: boolean | null;
  @Column({ name: 'rule_version', type: 'int', nullable: true }) ruleVersion: number | null;
  @Column({ name: 'lead_time_days', type: 'int', default: 2 }) leadTimeDays: number;
  /** False when the rulebook had the lead time not on file (lead time 0: file by the departure at the latest). */
  @Column({ name: 'lead_time_known', type: 'boolean', default: true }) leadTimeKnown: boolean;
  @Column({ name: 'assignee_id', type: 'uuid', nullable: true }) assigneeId: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'assignee_id' }) assignee?: User | null;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  @Column({ name: 'amendment_reason', type: 'text', nullable: true }) amendmentReason: string | null;
  @Column({ name: 'expiry_warning', type: 'text', nullable: true }) expiryWarning: string | null;
  @Column({ name: 'expiry_checked_at', type: 'timestamptz', nullable: true }) expiryCheckedAt: Date | null;
  /** The move's requested departure, kept on the permit row by a trigger (the queue sorts on it). */
  @Column({ type: 'date', nullable: true, insert: false, update: false }) departure: string | null;
  /** The date to file by (departure less the lead time, see fileByDate), kept on the row by a trigger. */
  @Column({ name: 'file_by', type: 'date', nullable: true, insert: false, update: false }) fileBy: string | null;
  /** 0 while the permit is open, 1 once issued or void: the queue's first sort key. */
  @Column({ name: 'urgency_group', type: 'smallint', nullable: true, insert: false, update: false, generatedType: 'STORED', asExpression: URGENCY_GROUP_SQL })
  urgencyGroup: number | null;
  @Column({ type: 'int', default: 1 }) version: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
