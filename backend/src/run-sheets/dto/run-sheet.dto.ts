import { ArrayMaxSize, IsArray, IsBoolean, IsIn, IsNumber, IsOptional, IsString, Length, Max, Min } from 'class-validator';
import type { AcknowledgeRequest, DepartureChecksRequest, GaugeReading, OverrideChecksRequest, ScaleWeight } from '@amberline/common';
import { Nested } from '../../core/validators';

export class GaugeReadingDto implements GaugeReading {
  @IsIn(['trailer']) group: 'trailer';
  @IsNumber() @Min(0) @Max(150, { message: 'psi must not exceed 150' }) psi: number;
}

export class ScaleWeightDto implements ScaleWeight {
  @IsIn(['trailer']) group: 'trailer';
  @IsNumber() @Min(1000, { message: 'lb must be at least 1,000' }) @Max(200_000, { message: 'lb must not exceed 200,000' }) lb: number;
  @IsOptional() @IsString() @Length(1, 60) ticket?: string;
}

export class OverrideChecksDto implements OverrideChecksRequest {
  @IsString({ message: 'reason must say why the checks may pass' }) @Length(3, 500, { message: 'reason must say why the checks may pass (3–500 characters)' }) reason: string;
}

export class DepartureChecksDtoIn implements DepartureChecksRequest {
  @IsNumber() @Min(12, { message: 'measuredHeightIn must be at least 12 in' }) @Max(300, { message: 'measuredHeightIn must not exceed 300 in' }) measuredHeightIn: number;
  @IsNumber() @Min(12, { message: 'measuredWidthIn must be at least 12 in' }) @Max(360, { message: 'measuredWidthIn must not exceed 360 in' }) measuredWidthIn: number;
  @IsNumber() @Min(120, { message: 'measuredLengthIn must be at least 120 in' }) @Max(2400, { message: 'measuredLengthIn must not exceed 2,400 in' }) measuredLengthIn: number;
  @IsBoolean() sliderPinsLocked: boolean;
  @IsBoolean() tiresInflated: boolean;
  @IsBoolean() markingsInPlace: boolean;
  @IsBoolean() permitsOnBoard: boolean;
  @IsArray() @ArrayMaxSize(4) @Nested(() => GaugeReadingDto, { each: true }) gaugeReadings: GaugeReadingDto[];
  @IsOptional() @IsArray() @ArrayMaxSize(4) @Nested(() => ScaleWeightDto, { each: true }) scaleWeights?: ScaleWeightDto[];
}

export class AcknowledgeDto implements AcknowledgeRequest {
  @IsString() @Length(64, 64, { message: 'fingerprint must be the 64-character fingerprint shown on the run sheet' }) fingerprint: string;
}
