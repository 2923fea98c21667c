import { Column, Entity, PrimaryColumn } from 'typeorm';

@Entity({ name: 'jurisdictions' })
export class Jurisdiction {
  @PrimaryColumn({ type: 'varchar', length: 2 }) code: string;
  @Column({ type: 'varchar', length: 60 }) name: string;
  @Column({ name: 'current_version', type: 'int', default: 0 }) currentVersion: number;
}
