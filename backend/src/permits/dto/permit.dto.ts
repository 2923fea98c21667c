import {
  ArrayMaxSize, ArrayMinSize, IsArray, IsBoolean, IsIn, IsInt, IsNumber, IsObject, IsOptional, IsString, IsUUID, Length, Matches, Max, MaxLength, Min, ValidateIf,
} from 'class-validator';
import {
  PAYMENT_STATUSES, PERMIT_SORTS, PERMIT_STATUSES, PERMIT_TYPES,
  type AssignPermitsRequest, type PaymentStatus, type PayPermitRequest, type PermitConditions, type PermitTravelTerms, type PermitQueueStatus, type PermitSort, type PermitStatus, type PermitType, type UpdatePermitRequest,
} from '@amberline/common';
import { PageQuery } from '../../core/page-query.dto';
import { IsDateOrDateTime, IsLocalDateTime, MaxDecimals, Nested, Omittable } from '../../core/validators';

export class PermitConditionsDto implements PermitConditions {
  @IsOptional() @IsInt() @Min(0) @Max(6) escortsFront?: number;
  @IsOptional() @IsInt() @Min(0) @Max(6) escortsRear?: number;
  @IsOptional() @IsBoolean() heightPole?: boolean;
  @IsOptional() @IsString() @MaxLength(200) travelHours?: string;
  @IsOptional() @IsString() @MaxLength(200) holidays?: string;
  @IsOptional() @IsInt() @Min(5, { message: 'maxSpeedMph must be at least 5' }) @Max(80, { message: 'maxSpeedMph must not exceed 80' }) maxSpeedMph?: number;
  @IsOptional() @IsArray() @ArrayMaxSize(20) @IsString({ each: true }) @MaxLength(200, { each: true }) utilityContacts?: string[];
  /** Checked in full by the service (checkPermitTravelTerms), which names the field of any problem. */
  @IsOptional() @IsObject({ message: 'conditions.travel must be an object with any of hours, weekendBans, holidays, curfews' }) travel?: PermitTravelTerms;
}

export class UpdatePermitDto implements UpdatePermitRequest {
  @IsInt() @Min(1) version: number;
  @Omittable() @IsIn(PERMIT_STATUSES as unknown as string[], { message: `status must be one of ${PERMIT_STATUSES.join(', ')}` }) status?: PermitStatus;
  @IsOptional() @IsString() @Length(1, 500) reason?: string;
  @Omittable() @IsIn(PERMIT_TYPES as unknown as string[], { message: `permitType must be one of ${PERMIT_TYPES.join(', ')}` }) permitType?: PermitType;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsString() @Matches(/^[A-Za-z0-9][A-Za-z0-9 ./#-]{0,59}$/, { message: 'permitNumber must be 1–60 letters, digits, spaces or . / # -' }) permitNumber?: string | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsDateOrDateTime({ message: 'issuedAt must be an ISO date and time with its offset (2026-12-01T14:30:00Z) or a date (YYYY-MM-DD)' }) issuedAt?: string | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsLocalDateTime({ message: 'validFrom must be a local date and time, YYYY-MM-DDTHH:mm' }) validFrom?: string | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsLocalDateTime({ message: 'validTo must be a local date and time, YYYY-MM-DDTHH:mm' }) validTo?: string | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsString() @MaxLength(2000) routeText?: string | null;
  @Omittable() @Nested(() => PermitConditionsDto) conditions?: PermitConditionsDto;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsString() @MaxLength(4000) conditionsText?: string | null;
  @IsOptional()
  @ValidateIf((_, v) => v !== null)
  @IsNumber({}, { message: 'actualFeeUsd must be an amount in dollars with at most 2 decimals' })
  @MaxDecimals(2, { message: 'actualFeeUsd must be an amount in dollars with at most 2 decimals' })
  @Min(0.5, { message: 'actualFeeUsd must be more than $0 (at least $0.50)' })
  @Max(100000, { message: 'actualFeeUsd must not exceed $100,000' })
  actualFeeUsd?: number | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsUUID('4', { message: 'assigneeId must be the id of a user' }) assigneeId?: string | null;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsString() @MaxLength(4000) notes?: string | null;
}

export class ListPermitsQuery extends PageQuery {
  @IsOptional() @IsIn(['open', ...PERMIT_STATUSES], { message: `status must be open or one of ${PERMIT_STATUSES.join(', ')}` }) status?: PermitQueueStatus;
  @IsOptional() @Matches(/^[A-Z]{2}$/, { message: 'jurisdiction must be a two-letter state code' }) jurisdiction?: string;
  @IsOptional() @ValidateIf((_, v) => v !== 'me' && v !== 'none') @IsUUID('4', { message: 'assignee must be a user id, me or none' }) assignee?: string;
  @IsOptional() @IsUUID('4', { message: 'moveId must be the id of a move' }) moveId?: string;
  @IsOptional() @IsIn(PERMIT_SORTS as unknown as string[], { message: `sort must be one of ${PERMIT_SORTS.join(', ')}` }) sort: PermitSort = 'urgency';
}

export class AssignPermitsDto implements AssignPermitsRequest {
  @IsArray() @ArrayMinSize(1, { message: 'permitIds must list at least one permit' }) @ArrayMaxSize(200) @IsUUID('4', { each: true, message: 'permitIds must be permit ids' }) permitIds: string[];
  @ValidateIf((_, v) => v !== null) @IsUUID('4', { message: 'assigneeId must be the id of a user, or null' }) assigneeId: string | null;
}

export class PayPermitDto implements PayPermitRequest {
  @IsString() @Matches(/^pm_[A-Za-z0-9_]{1,60}$/, { message: 'paymentMethod must be a payment method id such as pm_card_visa' }) paymentMethod: string;
  @IsString() @Matches(/^[A-Za-z0-9_-]{8,64}$/, { message: 'idempotencyKey must be 8–64 letters, digits, - or _' }) idempotencyKey: string;
}

export class RefundPermitDto {
  @IsString() @Length(1, 500) reason: string;
}

export class ListPaymentsQuery extends PageQuery {
  @IsOptional() @IsUUID('4', { message: 'moveId must be the id of a move' }) moveId?: string;
  @IsOptional() @IsIn(PAYMENT_STATUSES as unknown as string[], { message: `status must be one of ${PAYMENT_STATUSES.join(', ')}` }) status?: PaymentStatus;
  @IsOptional() @Matches(/^[A-Z]{2}$/, { message: 'jurisdiction must be a two-letter state code' }) jurisdiction?: string;
}
