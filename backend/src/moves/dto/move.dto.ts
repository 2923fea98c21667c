import {
  ArrayMaxSize, ArrayMinSize, IsArray, IsBoolean, IsIn, IsInt, IsNumber, IsOptional, IsString, IsUUID, Length, Matches, Max, MaxLength, Min, ValidateIf,
} from 'class-validator';
import {
  ANCHOR_KINDS, MOVE_STAGES, WEIGHT_SOURCES,
  type AnchorKind, type MoveArticle, type MoveInput, type MoveStage, type MoveTiedown, type RoadType, type RouteSegmentInput, type StageChangeRequest, type ReassessRequest, type ReopenRequest, type TiedownPath, type UpdateMoveRequest, type WeightSource,
} from '@amberline/common';
import { PageQuery } from '../../core/page-query.dto';
import { IsCalendarDate, Nested, Omittable } from '../../core/validators';

const ROAD_TYPES: RoadType[] = ['two-lane', 'multilane', 'interstate'];
const PATHS: TiedownPath[] = ['direct', 'same-side', 'side-to-side'];

export class TiedownDto implements MoveTiedown {
  @IsOptional() @IsString() @MaxLength(60) label?: string;
  @IsIn(['chain', 'webbing', 'other']) kind: 'chain' | 'webbing' | 'other';
  @IsOptional() @IsIn(['5/16', '3/8', '1/2', '5/8']) chainSize?: string;
  @IsOptional() @IsIn([30, 43, 70, 80, 100]) chainGrade?: 30 | 43 | 70 | 80 | 100;
  @IsOptional() @IsIn(['1 3/4', '2', '3', '4']) webbingWidth?: string;
  @IsOptional() @IsNumber() @Min(100) @Max(100000) markedWllLb?: number;
  @IsIn(ANCHOR_KINDS as unknown as string[], { message: `anchorKind must be one of ${ANCHOR_KINDS.join(', ')}` }) anchorKind: AnchorKind;
  @IsIn(PATHS, { message: `path must be one of ${PATHS.join(', ')}` }) path: TiedownPath;
  @IsOptional() @IsBoolean() edgeProtection?: boolean;
}

export class ArticleDto implements MoveArticle {
  @IsString() @Length(1, 40) id: string;
  @IsString() @Length(1, 200) description: string;
  @IsNumber() @Min(1, { message: 'lengthIn must be more than 0' }) @Max(2400, { message: 'lengthIn must not exceed 2,400 in (200 ft)' }) lengthIn: number;
  @IsNumber() @Min(1, { message: 'widthIn must be more than 0' }) @Max(360, { message: 'widthIn must not exceed 360 in (30 ft)' }) widthIn: number;
  @IsNumber() @Min(1, { message: 'heightIn must be more than 0' }) @Max(300, { message: 'heightIn must not exceed 300 in (25 ft)' }) heightIn: number;
  @IsNumber() @Min(1, { message: 'weightLb must be more than 0' }) @Max(1_000_000, { message: 'weightLb must not exceed 1,000,000 lb' }) weightLb: number;
  @IsIn(WEIGHT_SOURCES as unknown as string[]) weightSource: WeightSource;
  @IsOptional() @IsNumber() @Min(0) @Max(2400) cgFromFrontIn?: number;
  @IsNumber() @Min(-600) @Max(2400) positionFromTrailerFrontIn: number;
  @IsOptional() @IsNumber() @Min(-120) @Max(120) lateralOffsetIn?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(48) dunnageIn?: number;
  @IsOptional() @IsNumber() @Min(0) @Max(84) deckHeightIn?: number;
  @IsBoolean() blockedForward: boolean;
  @IsOptional() @IsBoolean() heavyEquipment?: boolean;
  @IsOptional() @IsBoolean() sharpEdges?: boolean;
  @IsArray() @ArrayMaxSize(40) @Nested(() => TiedownDto, { each: true }) tiedowns: TiedownDto[];
}

export class RouteSegmentDto implements RouteSegmentInput {
  @IsInt() @Min(1) @Max(99) order: number;
  @IsString() @Matches(/^[A-Z]{2}$/, { message: 'jurisdiction must be a two-letter state code' }) jurisdiction: string;
  @IsString() @Length(1, 200) roads: string;
  @IsNumber() @Min(0.1, { message: 'miles must be more than 0' }) @Max(3000) miles: number;
  @IsIn(ROAD_TYPES, { message: `roadType must be one of ${ROAD_TYPES.join(', ')}` }) roadType: RoadType;
  @IsOptional() @IsBoolean() urban?: boolean;
  @IsOptional() @Matches(/^\d{5}$/, { message: 'zip must be a five-digit ZIP code' }) zip?: string;
  @IsOptional() @IsNumber() @Min(18) @Max(72) lat?: number;
  @IsOptional() @IsNumber() @Min(-180) @Max(-60) lon?: number;
}

export class CreateMoveDto implements MoveInput {
  @IsString() @Length(1, 120) customer: string;
  @IsOptional() @IsString() @MaxLength(60) customerRef?: string;
  @IsString() @Length(1, 200) commodity: string;
  @IsArray() @ArrayMinSize(1) @ArrayMaxSize(10) @Nested(() => ArticleDto, { each: true }) articles: ArticleDto[];
  @IsUUID('4', { message: 'tractorId must be the id of a tractor' }) tractorId: string;
  @IsUUID('4', { message: 'trailerId must be the id of a trailer' }) trailerId: string;
  @IsOptional() @IsNumber() @Min(0) @Max(200) sliderSettingFt?: number | null;
  @IsArray() @ArrayMinSize(1) @ArrayMaxSize(30) @Nested(() => RouteSegmentDto, { each: true }) route: RouteSegmentDto[];
  @IsString() @Length(1, 200) origin: string;
  @IsString() @Length(1, 200) destination: string;
  @IsCalendarDate({ message: 'requestedDeparture must be a YYYY-MM-DD date' }) requestedDeparture: string;
  @IsInt() @Min(1) @Max(30) travelDays: number;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsInt({ message: 'dailyMiles must be whole miles' }) @Min(20, { message: 'dailyMiles must be at least 20' }) @Max(1000, { message: 'dailyMiles must not exceed 1,000' }) dailyMiles?: number | null;
  @IsOptional() @IsUUID('4', { message: 'driverId must be the id of a driver' }) driverId?: string | null;
  @IsOptional() @IsString() @MaxLength(2000) notes?: string;
}

export class UpdateMoveDto implements UpdateMoveRequest {
  @IsInt() @Min(1) version: number;
  @Omittable() @IsString() @Length(1, 120) customer?: string;
  @IsOptional() @IsString() @MaxLength(60) customerRef?: string;
  @Omittable() @IsString() @Length(1, 200) commodity?: string;
  @Omittable() @IsArray() @ArrayMinSize(1) @ArrayMaxSize(10) @Nested(() => ArticleDto, { each: true }) articles?: ArticleDto[];
  @Omittable() @IsUUID('4', { message: 'tractorId must be the id of a tractor' }) tractorId?: string;
  @Omittable() @IsUUID('4', { message: 'trailerId must be the id of a trailer' }) trailerId?: string;
  @IsOptional() @IsNumber() @Min(0) @Max(200) sliderSettingFt?: number | null;
  @Omittable() @IsArray() @ArrayMinSize(1) @ArrayMaxSize(30) @Nested(() => RouteSegmentDto, { each: true }) route?: RouteSegmentDto[];
  @Omittable() @IsString() @Length(1, 200) origin?: string;
  @Omittable() @IsString() @Length(1, 200) destination?: string;
  @Omittable() @IsCalendarDate({ message: 'requestedDeparture must be a YYYY-MM-DD date' }) requestedDeparture?: string;
  @Omittable() @IsInt() @Min(1) @Max(30) travelDays?: number;
  @IsOptional() @ValidateIf((_, v) => v !== null) @IsInt({ message: 'dailyMiles must be whole miles' }) @Min(20, { message: 'dailyMiles must be at least 20' }) @Max(1000, { message: 'dailyMiles must not exceed 1,000' }) dailyMiles?: number | null;
  @IsOptional() @IsUUID('4', { message: 'driverId must be the id of a driver' }) driverId?: string | null;
  @IsOptional() @IsString() @MaxLength(2000) notes?: string;
}

export class ListMovesQuery extends PageQuery {
  @IsOptional() @IsIn(MOVE_STAGES as unknown as string[]) stage?: MoveStage;
  @IsOptional() @IsString() @MaxLength(100) search?: string;
  @IsOptional() @IsIn(['departure', '-departure', 'updated']) sort: 'departure' | '-departure' | 'updated' = 'departure';
  @IsOptional() @Matches(/^[A-Z]{2}$/) jurisdiction?: string;
}

export class StageChangeDto implements StageChangeRequest {
  @IsIn(MOVE_STAGES as unknown as string[], { message: `to must be one of ${MOVE_STAGES.join(', ')}` }) to: MoveStage;
  @IsOptional() @IsString() @Length(1, 500) reason?: string;
  @IsOptional() @IsInt() @Min(1) version?: number;
}

export class PreviewDto extends CreateMoveDto {}

export class ReassessDto implements ReassessRequest {
  @IsInt() @Min(1) version: number;
  @IsOptional() @IsString() @Length(1, 500) reason?: string;
}

export class ReopenDto implements ReopenRequest {
  @IsInt() @Min(1) version: number;
  @IsString({ message: 'reason must say why the move is reopened' }) @Length(1, 500, { message: 'reason must say why the move is reopened (1–500 characters)' }) reason: string;
}
