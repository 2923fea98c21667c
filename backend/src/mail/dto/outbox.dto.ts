import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, Max, Min } from 'class-validator';
import { MAIL_STATUSES, type MailStatus } from '@amberline/common';

export class OutboxQuery {
  @IsOptional() @IsIn(MAIL_STATUSES as unknown as string[], { message: `status must be one of ${MAIL_STATUSES.join(', ')}` }) status?: MailStatus;
  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(200) limit = 50;
}
