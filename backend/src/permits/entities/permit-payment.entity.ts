import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { PaymentStatus } from '@amberline/common';
import { User } from '../../users/entities/user.entity';
import { Permit } from './permit.entity';

/** One attempt to pay a permit's fee through the payment processor. */
@Entity({ name: 'permit_payments' })
export class PermitPayment {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'permit_id', type: 'uuid' }) permitId: string;
  @ManyToOne(() => Permit) @JoinColumn({ name: 'permit_id' }) permit?: Permit;
  @Column({ name: 'move_id', type: 'uuid' }) moveId: string;
  @Column({ type: 'int' }) attempt: number;
  /** The key the client sent for this attempt (a retry sends the same one). */
  @Column({ name: 'client_key', type: 'varchar', length: 100 }) clientKey: string;
  /** The key sent to the processor: per permit and attempt. */
  @Column({ name: 'idempotency_key', type: 'varchar', length: 160 }) idempotencyKey: string;
  @Column({ name: 'amount_cents', type: 'int' }) amountCents: number;
  @Column({ type: 'char', length: 3, default: 'usd' }) currency: string;
  @Column({ type: 'varchar', length: 20, default: 'pending' }) status: PaymentStatus;
  @Column({ name: 'payment_method', type: 'varchar', length: 80 }) paymentMethod: string;
  @Column({ name: 'stripe_payment_intent_id', type: 'varchar', length: 100, nullable: true }) stripePaymentIntentId: string | null;
  @Column({ name: 'stripe_charge_id', type: 'varchar', length: 100, nullable: true }) stripeChargeId: string | null;
  @Column({ name: 'stripe_refund_id', type: 'varchar', length: 100, nullable: true }) stripeRefundId: string | null;
  @Column({ name: 'decline_code', type: 'varchar', length: 60, nullable: true }) declineCode: string | null;
  @Column({ name: 'failure_message', type: 'text', nullable: true }) failureMessage: string | null;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdById: string | null;
  @ManyToOne(() => User, { nullable: true }) @JoinColumn({ name: 'created_by' }) createdBy?: User | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
  @Column({ name: 'succeeded_at', type: 'timestamptz', nullable: true }) succeededAt: Date | null;
  @Column({ name: 'refunded_at', type: 'timestamptz', nullable: true }) refundedAt: Date | null;
}
