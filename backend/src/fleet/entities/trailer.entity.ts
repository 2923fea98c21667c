import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn, VersionColumn } from 'typeorm';
import type { TrailerInput, TrailerType } from '@amberline/common';

export type TrailerSpec = Omit<TrailerInput, 'unitNumber' | 'type'>;

@Entity({ name: 'trailers' })
export class Trailer {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'unit_number', type: 'varchar', length: 40 }) unitNumber: string;
  @Column({ type: 'varchar', length: 30 }) type: TrailerType;
  @Column({ type: 'jsonb' }) spec: TrailerSpec;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @VersionColumn() version: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
