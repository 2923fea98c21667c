import {
  ArrayMaxSize, ArrayMinSize, IsArray, IsBoolean, IsIn, IsInt, IsNumber, IsOptional, IsString, Length, Max, MaxLength, Min,
} from 'class-validator';
import {
  ANCHOR_KINDS, TRAILER_TYPES, type AnchorKind, type AnchorPoint, type GaugeCalibrationPoint, type TractorInput, type TrailerInput, type TrailerType,
} from '@amberline/common';
import { Nested } from '../../core/validators';

export class FifthWheelRangeDto {
  @IsNumber() @Min(-10) @Max(10) min: number;
  @IsNumber() @Min(-10) @Max(10) max: number;
}

export class TractorInputDto implements TractorInput {
  @IsString() @Length(1, 40) unitNumber: string;
  @IsString() @Length(1, 20) plate: string;
  @IsNumber() @Min(1000) @Max(40000) steerTareLb: number;
  @IsNumber() @Min(1000) @Max(60000) driveTareLb: number;
  @IsNumber() @Min(8) @Max(35) wheelbaseFt: number;
  @IsNumber() @Min(-5) @Max(5) fifthWheelAheadOfDriveFt: number;
  @IsOptional() @Nested(() => FifthWheelRangeDto) fifthWheelRangeFt?: FifthWheelRangeDto | null;
  @IsNumber() @Min(0) @Max(240) bumperToSteerIn: number;
  @IsNumber() @Min(60) @Max(120) widthIn: number;
  @IsNumber() @Min(60) @Max(170) heightIn: number;
  @IsArray() @ArrayMinSize(1) @ArrayMaxSize(5) @IsNumber({}, { each: true }) driveAxleOffsetsFt: number[];
}

export class DeckSectionDto {
  @IsString() @Length(1, 40) name: string;
  @IsNumber() @Min(0) @Max(2400) fromFrontIn: number;
  @IsNumber() @Min(1) @Max(2400) toFrontIn: number;
  @IsNumber() @Min(6) @Max(84) heightIn: number;
}

export class SliderRangeDto {
  @IsNumber() @Min(0) @Max(200) minFromKingpinFt: number;
  @IsNumber() @Min(0) @Max(200) maxFromKingpinFt: number;
  @IsNumber() @Min(1) @Max(60) holeSpacingIn: number;
}

export class AnchorPointDto implements AnchorPoint {
  @IsIn(ANCHOR_KINDS as unknown as string[]) kind: AnchorKind;
  @IsInt() @Min(0) @Max(60) countPerSide: number;
  @IsNumber() @Min(1) @Max(100000) wllLb: number;
}

export class GaugePointDto implements GaugeCalibrationPoint {
  @IsNumber() @Min(0) @Max(150) psi: number;
  @IsNumber() @Min(0) @Max(200000) loadLb: number;
}

export class TrailerInputDto implements TrailerInput {
  @IsString() @Length(1, 40) unitNumber: string;
  @IsIn(TRAILER_TYPES as unknown as string[], { message: `type must be one of ${TRAILER_TYPES.join(', ')}` }) type: TrailerType;
  @IsNumber() @Min(240) @Max(2400) lengthIn: number;
  @IsNumber() @Min(60) @Max(200) widthIn: number;
  @IsOptional() @IsNumber() @Min(0) @Max(200) heightIn?: number | null;
  @IsArray() @ArrayMinSize(1) @ArrayMaxSize(5) @Nested(() => DeckSectionDto, { each: true }) decks: DeckSectionDto[];
  @IsNumber() @Min(2000) @Max(120000) tareLb: number;
  @IsNumber() @Min(0) @Max(200) tareCgFromKingpinFt: number;
  @IsNumber() @Min(0) @Max(600) kingpinFromFrontIn: number;
  @IsArray() @ArrayMinSize(1) @ArrayMaxSize(13) @IsNumber({}, { each: true }) axleOffsetsFt: number[];
  @IsNumber() @Min(5) @Max(200) axleGroupFromKingpinFt: number;
  @IsOptional() @Nested(() => SliderRangeDto) slider?: SliderRangeDto | null;
  @IsArray() @ArrayMaxSize(10) @Nested(() => AnchorPointDto, { each: true }) anchorPoints: AnchorPointDto[];
  @IsArray() @ArrayMaxSize(20) @Nested(() => GaugePointDto, { each: true }) gaugeCalibration: GaugePointDto[];
  @IsOptional() @IsString() @MaxLength(40) tireSize?: string | null;
}

export class FleetActiveDto {
  @IsBoolean() active: boolean;
  @IsInt() @Min(1) version: number;
}
