import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { JurisdictionRule } from '@amberline/common';
import { User } from '../../users/entities/user.entity';

/** One version of a jurisdiction's rule record. Versions are never changed, only added. */
@Entity({ name: 'rule_versions' })
export class RuleVersion {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 2 }) code: string;
  @Column({ type: 'int' }) version: number;
  @Column({ type: 'jsonb' }) record: JurisdictionRule;
  @Column({ type: 'boolean' }) sample: boolean;
  @Column({ name: 'as_of', type: 'date' }) asOf: string;
  @Column({ type: 'text', nullable: true }) note: string | null;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdById: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'created_by' }) createdBy?: User | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
