import { ApiProperty } from '@nestjs/swagger';
import { IsString, Length, MaxLength } from 'class-validator';
import { LIMITS, type LoginRequest } from '@amberline/common';

export class LoginDto implements LoginRequest {
  @ApiProperty() @IsString() @Length(3, LIMITS.emailMax)
  email: string;

  @ApiProperty() @IsString() @Length(1, LIMITS.passwordMax) @MaxLength(LIMITS.passwordMax)
  password: string;
}
