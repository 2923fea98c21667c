import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';
import { LIMITS } from '@amberline/common';

/** The paging of every list: whole page numbers from 1 to LIMITS.pageMax, so the row offset stays a small integer. */
export class PageQuery {
  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(LIMITS.pageMax)
  page = 1;

  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(LIMITS.pageSizeMax)
  pageSize = 20;
}
