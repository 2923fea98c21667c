import { Column, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../../users/entities/user.entity';

/** One uploaded version of a permit's PDF; the bytes live in the file store under `storageKey`. */
@Entity({ name: 'permit_documents' })
export class PermitDocument {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'permit_id', type: 'uuid' }) permitId: string;
  @Column({ type: 'int' }) version: number;
  @Column({ name: 'file_name', type: 'varchar', length: 160 }) fileName: string;
  @Column({ type: 'char', length: 64 }) sha256: string;
  @Column({ name: 'size_bytes', type: 'int' }) sizeBytes: number;
  @Column({ name: 'content_type', type: 'varchar', length: 60, default: 'application/pdf' }) contentType: string;
  @Column({ name: 'storage_key', type: 'varchar', length: 200 }) storageKey: string;
  @Column({ name: 'uploaded_by', type: 'uuid', nullable: true }) uploadedById: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'uploaded_by' }) uploadedBy?: User | null;
  @Column({ name: 'uploaded_at', type: 'timestamptz', default: () => 'now()' }) uploadedAt: Date;
}
