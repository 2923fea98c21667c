import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { TractorInput } from '@amberline/common';

export type TractorSpec = Omit<TractorInput, 'unitNumber' | 'plate'>;

@Entity({ name: 'tractors' })
export class Tractor {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'unit_number', type: 'varchar', length: 40 }) unitNumber: string;
  @Column({ type: 'varchar', length: 20 }) plate: string;
  @Column({ type: 'jsonb' }) spec: TractorSpec;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @VersionColumn() version: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
