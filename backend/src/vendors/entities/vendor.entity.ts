import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { EscortOperator, EscortVehicle, VendorInsurance, VendorRates } from '@amberline/common';

/** An outside escort (pilot car) company. Vendors have no account; they answer through e-mailed links. */
@Entity({ name: 'vendors' })
export class Vendor {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 120 }) company: string;
  @Column({ name: 'contact_name', type: 'varchar', length: 120 }) contactName: string;
  @Column({ type: 'varchar', length: 254 }) email: string;
  @Column({ type: 'varchar', length: 40 }) phone: string;
  @Column({ type: 'varchar', length: 2, array: true }) states: string[];
  @Column({ type: 'jsonb' }) operators: EscortOperator[];
  @Column({ type: 'jsonb' }) insurance: VendorInsurance;
  @Column({ type: 'jsonb' }) vehicles: EscortVehicle[];
  @Column({ type: 'jsonb' }) rates: VendorRates;
  @Column({ type: 'text', nullable: true }) notes: string | null;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @Column({ type: 'int', default: 1 }) version: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
