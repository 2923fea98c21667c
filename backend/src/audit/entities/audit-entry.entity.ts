import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity';

/** One change: who, when, what before, what after. */
@Entity({ name: 'audit_entries' })
export class AuditEntry {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ name: 'move_id', type: 'uuid', nullable: true })
  moveId: string | null;

  @Column({ type: 'varchar', length: 30 })
  entity: string;

  @Column({ name: 'entity_id', type: 'varchar', length: 60 })
  entityId: string;

  @Column({ type: 'varchar', length: 40 })
  action: string;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @ManyToOne(() => User, { nullable: true })
  @JoinColumn({ name: 'actor_id' })
  actor?: User | null;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  at: Date;

  @Column({ type: 'jsonb', nullable: true })
  before: unknown;

  @Column({ type: 'jsonb', nullable: true })
  after: unknown;

  @Column({ type: 'text', nullable: true })
  reason: string | null;
}
