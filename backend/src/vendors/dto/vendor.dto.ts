import { Transform } from 'class-transformer';
import {
  ArrayMaxSize, ArrayMinSize, IsArray, IsBoolean, IsDefined, IsEmail, IsIn, IsInt, IsNumber, IsOptional, IsString, Length, Matches, Max, MaxLength, Min,
} from 'class-validator';
import {
  JURISDICTION_CODES, LIMITS, RATE_BASES, type EscortCertification, type EscortEquipment, type EscortOperator, type EscortVehicle, type RateBasis,
  type UpdateVendorRequest, type VendorInput, type VendorInsurance, type VendorRates,
} from '@amberline/common';
import { IsCalendarDate, Nested } from '../../core/validators';

const dateMsg = (f: string) => ({ message: `${f} must be a date, YYYY-MM-DD` });
const STATE_MSG = { each: true, message: 'each state must be a postal code of the contiguous US or DC, e.g. TX' };
const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CertificationDto implements EscortCertification {
  @IsIn(JURISDICTION_CODES, { message: 'state must be a postal code of the contiguous US or DC, e.g. TX' }) state: string;
  @Transform(trim) @IsString() @Length(1, 60) number: string;
  @IsCalendarDate(dateMsg('expires')) expires: string;
}

export class OperatorDto implements EscortOperator {
  @Transform(trim) @IsString() @Length(1, 120) name: string;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(40) phone?: string;
  @IsArray() @ArrayMaxSize(60) @Nested(() => CertificationDto, { each: true }) certifications: CertificationDto[];
}

export class EquipmentDto implements EscortEquipment {
  @IsBoolean() heightPole: boolean;
  @IsBoolean() amberLights: boolean;
  @IsBoolean() signs: boolean;
  @IsBoolean() flags: boolean;
}

export class VehicleDto implements EscortVehicle {
  @Transform(trim) @IsString() @Length(1, 80) label: string;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(20) plate?: string;
  @IsDefined({ message: 'equipment: say which of height pole, amber lights, signs and flags the vehicle carries' }) @Nested(() => EquipmentDto) equipment: EquipmentDto;
}

export class InsuranceDto implements VendorInsurance {
  @IsOptional() @Transform(trim) @IsString() @MaxLength(120) carrier?: string;
  @IsOptional() @Transform(trim) @IsString() @MaxLength(60) policyNumber?: string;
  @IsNumber() @Min(0) @Max(100_000_000) liabilityLimitUsd: number;
  @IsOptional() @IsNumber() @Min(0) @Max(100_000_000) autoLimitUsd?: number;
  @IsCalendarDate(dateMsg('expires')) expires: string;
}

export class RatesDto implements VendorRates {
  @IsIn(RATE_BASES as unknown as string[], { message: `basis must be one of ${RATE_BASES.join(', ')}` }) basis: RateBasis;
  @IsOptional() @IsNumber() @Min(0) @Max(100) perMileUsd?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(10_000) perDayUsd?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(10_000) minimumUsd?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(10_000) noGoUsd?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(10_000) layoverUsd?: number;
}

export class VendorInputDto implements VendorInput {
  @Transform(trim) @IsString() @Length(1, 120) company: string;
  @Transform(trim) @IsString() @Length(1, LIMITS.nameMax) contactName: string;
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value)) @IsEmail({}, { message: 'email must be an e-mail address' }) @MaxLength(LIMITS.emailMax) email: string;
  @Transform(trim) @IsString() @Matches(/^[0-9+()\-. ]{7,40}$/, { message: 'phone must be 7–40 digits, spaces, + ( ) - .' }) phone: string;
  @IsArray() @ArrayMinSize(1, { message: 'states must list at least one state the vendor covers' }) @ArrayMaxSize(49) @IsIn(JURISDICTION_CODES, STATE_MSG) states: string[];
  @IsArray() @ArrayMaxSize(100) @Nested(() => OperatorDto, { each: true }) operators: OperatorDto[];
  @IsDefined() @Nested(() => InsuranceDto) insurance: InsuranceDto;
  @IsArray() @ArrayMaxSize(100) @Nested(() => VehicleDto, { each: true }) vehicles: VehicleDto[];
  @IsDefined() @Nested(() => RatesDto) rates: RatesDto;
  @IsOptional() @IsString() @MaxLength(2000) notes?: string;
  @IsOptional() @IsBoolean() active?: boolean;
}

export class UpdateVendorDto extends VendorInputDto implements UpdateVendorRequest {
  @IsInt() @Min(1) version: number;
}

export class VendorsQueryDto {
  @IsOptional() @IsString() @MaxLength(120) search?: string;
  @IsOptional() @IsIn(JURISDICTION_CODES, { message: 'state must be a postal code, e.g. TX' }) state?: string;
  @IsOptional() @Transform(({ value }) => value === true || value === 'true') @IsBoolean() includeInactive?: boolean;
}
