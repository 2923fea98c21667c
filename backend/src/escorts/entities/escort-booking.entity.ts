import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { BookingStatus, EscortAnswer, EscortPosition, EscortRequestView } from '@amberline/common';
import { Move } from '../../moves/entities/move.entity';
import { User } from '../../users/entities/user.entity';
import { Vendor } from '../../vendors/entities/vendor.entity';

/** What the request e-mail said about the move, kept so the vendor's page shows the same. */
export type RequestSummary = Pick<EscortRequestView, 'move' | 'heightPoleSetIn' | 'requestedBy' | 'certificationStates'> & { timeZone: string };

/** One escort position (lead, chase, height pole; seat 1, 2…) on some jurisdictions of a move, asked of one vendor. */
@Entity({ name: 'escort_bookings' })
export class EscortBooking {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'move_id', type: 'uuid' }) moveId: string;
  @ManyToOne(() => Move) @JoinColumn({ name: 'move_id' }) move?: Move;
  @Column({ name: 'vendor_id', type: 'uuid' }) vendorId: string;
  @ManyToOne(() => Vendor) @JoinColumn({ name: 'vendor_id' }) vendor?: Vendor;
  @Column({ type: 'varchar', length: 20 }) position: EscortPosition;
  @Column({ type: 'int' }) seat: number;
  @Column({ type: 'varchar', length: 2, array: true }) jurisdictions: string[];
  @Column({ name: 'start_date', type: 'date' }) startDate: string;
  @Column({ name: 'end_date', type: 'date' }) endDate: string;
  @Column({ name: 'meeting_point', type: 'varchar', length: 300 }) meetingPoint: string;
  @Column({ name: 'meeting_time', type: 'varchar', length: 5, nullable: true }) meetingTime: string | null;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  @Column({ type: 'varchar', length: 20, default: 'requested' }) status: BookingStatus;
  @Column({ name: 'request_summary', type: 'jsonb' }) requestSummary: RequestSummary;
  @Column({ type: 'jsonb', default: () => `'[]'::jsonb` }) warnings: string[];
  @Column({ type: 'jsonb', nullable: true }) answer: EscortAnswer | null;
  @Column({ name: 'cancel_reason', type: 'text', nullable: true }) cancelReason: string | null;
  @Column({ name: 'requested_by', type: 'uuid', nullable: true }) requestedById: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'requested_by' }) requestedBy?: User | null;
  @Column({ name: 'requested_at', type: 'timestamptz' }) requestedAt: Date;
  @Column({ name: 'responded_at', type: 'timestamptz', nullable: true }) respondedAt: Date | null;
  @Column({ name: 'reminder_sent_at', type: 'timestamptz', nullable: true }) reminderSentAt: Date | null;
  @Column({ name: 'departure_reminder_sent_at', type: 'timestamptz', nullable: true }) departureReminderSentAt: Date | null;
  @Column({ name: 'plan_revision', type: 'int' }) planRevision: number;
  @Column({ type: 'int', default: 1 }) version: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
