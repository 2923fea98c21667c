import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity({ name: 'run_sheet_acknowledgements' })
export class RunSheetAcknowledgement {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'move_id', type: 'uuid' }) moveId: string;
  @Column({ name: 'driver_id', type: 'uuid' }) driverId: string;
  @Column({ name: 'checks_id', type: 'uuid' }) checksId: string;
  @Column({ type: 'varchar', length: 64 }) fingerprint: string;
  @Column({ name: 'acknowledged_at', type: 'timestamptz', default: () => 'now()' }) acknowledgedAt: Date;
  @Column({ name: 'voided_at', type: 'timestamptz', nullable: true }) voidedAt: Date | null;
  @Column({ name: 'void_reason', type: 'text', nullable: true }) voidReason: string | null;
}
