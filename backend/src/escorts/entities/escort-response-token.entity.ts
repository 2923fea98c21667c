import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A link a vendor answers through. Only the SHA-256 of the token is stored; the token exists only in the e-mail. */
@Entity({ name: 'escort_response_tokens' })
export class EscortResponseToken {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'booking_id', type: 'uuid' }) bookingId: string;
  @Column({ name: 'token_hash', type: 'char', length: 64 }) tokenHash: string;
  @Column({ name: 'expires_at', type: 'timestamptz' }) expiresAt: Date;
  @Column({ name: 'used_at', type: 'timestamptz', nullable: true }) usedAt: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
