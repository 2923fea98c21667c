import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { PermitStatus } from '@amberline/common';
import { User } from '../../users/entities/user.entity';

/** A permit as it stood after one change: the history kept for amendments. */
@Entity({ name: 'permit_versions' })
export class PermitVersion {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'permit_id', type: 'uuid' }) permitId: string;
  @Column({ type: 'int' }) version: number;
  @Column({ type: 'varchar', length: 20 }) status: PermitStatus;
  @Column({ type: 'jsonb' }) snapshot: object;
  @Column({ type: 'text', nullable: true }) reason: string | null;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdById: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'created_by' }) createdBy?: User | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
