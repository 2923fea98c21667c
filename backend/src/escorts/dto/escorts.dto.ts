import { Transform } from 'class-transformer';
import {
  ArrayMaxSize, ArrayMinSize, IsArray, IsIn, IsInt, IsOptional, IsString, IsUUID, Length, Matches, Max, MaxLength, Min,
} from 'class-validator';
import {
  ESCORT_DECISIONS, ESCORT_POSITIONS, JURISDICTION_CODES,
  type CancelEscortBookingRequest, type CreateEscortBookingRequest, type EscortAnswer, type EscortDecision, type EscortPosition,
} from '@amberline/common';
import { IsCalendarDate, Nested } from '../../core/validators';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CreateEscortBookingDto implements CreateEscortBookingRequest {
  @IsUUID('all', { message: 'vendorId must be a vendor id' }) vendorId: string;
  @IsIn(ESCORT_POSITIONS as unknown as string[], { message: `position must be one of ${ESCORT_POSITIONS.join(', ')}` }) position: EscortPosition;
  @IsInt() @Min(1) @Max(9) seat: number;
  @IsArray() @ArrayMinSize(1, { message: 'jurisdictions must name at least one state on the route' }) @ArrayMaxSize(49)
  @IsIn(JURISDICTION_CODES, { each: true, message: 'each jurisdiction must be a postal code, e.g. TX' })
  jurisdictions: string[];
  @Transform(trim) @IsString() @Length(1, 300) meetingPoint: string;
  @IsOptional() @Matches(/^([01]\d|2[0-3]):[0-5]\d$/, { message: 'meetingTime must be HH:MM, 24-hour' }) meetingTime?: string;
  @IsOptional() @IsString() @MaxLength(2000) notes?: string;
}

export class CancelEscortBookingDto implements CancelEscortBookingRequest {
  @Transform(trim) @IsString() @Length(1, 500, { message: 'reason: say why the booking is called off' }) reason: string;
  @IsInt() @Min(1) version: number;
}

export class GivenCertificationDto {
  @IsIn(JURISDICTION_CODES, { message: 'state must be a postal code, e.g. TX' }) state: string;
  @Transform(trim) @IsString() @Length(1, 60) number: string;
}

/** The vendor's answer through the link: confirm (with operator, vehicle, phone, certificates), decline, or propose other dates. */
export class EscortAnswerDto implements EscortAnswer {
  @IsIn(ESCORT_DECISIONS as unknown as string[], { message: `decision must be one of ${ESCORT_DECISIONS.join(', ')}` }) decision: EscortDecision;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(120) operatorName?: string;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(120) vehicle?: string;
  @IsOptional() @Transform(trim) @IsString() @Matches(/^[0-9+()\-. ]{7,40}$/, { message: 'phone must be 7–40 digits, spaces, + ( ) - .' }) phone?: string;
  @IsOptional() @IsArray() @ArrayMaxSize(49) @Nested(() => GivenCertificationDto, { each: true }) certifications?: GivenCertificationDto[];
  @IsOptional() @Transform(trim) @IsString() @MaxLength(1000) reason?: string;
  @IsOptional() @IsCalendarDate({ message: 'proposedStart must be a date, YYYY-MM-DD' }) proposedStart?: string;
  @IsOptional() @IsCalendarDate({ message: 'proposedEnd must be a date, YYYY-MM-DD' }) proposedEnd?: string;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(1000) note?: string;
}
