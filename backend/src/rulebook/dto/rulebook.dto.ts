import { IsObject, IsString, Length } from 'class-validator';
import type { JurisdictionRule, UpdateRuleRequest } from '@amberline/common';

export class UpdateRuleDto implements UpdateRuleRequest {
  /** The whole record; checked by the rulebook service against the engine's rule shape. */
  @IsObject() record: JurisdictionRule;
  @IsString() @Length(3, 500) note: string;
}
