import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsBoolean, IsEmail, IsIn, IsInt, IsOptional, IsString, Length, Max, MaxLength, Min } from 'class-validator';
import { LIMITS, ROLES, type CreateUserRequest, type Role, type UpdateUserRequest, type UserDto } from '@amberline/common';
import type { User } from '../entities/user.entity';

export class CreateUserDto implements CreateUserRequest {
  @ApiProperty() @IsEmail({}, { message: 'email must be an e-mail address' }) @MaxLength(LIMITS.emailMax)
  email: string;

  @ApiProperty() @IsString() @Length(1, LIMITS.nameMax)
  name: string;

  @ApiProperty({ enum: ROLES }) @IsIn(ROLES as unknown as string[], { message: `role must be one of ${ROLES.join(', ')}` })
  role: Role;

  @ApiProperty() @IsString() @Length(LIMITS.passwordMin, LIMITS.passwordMax)
  password: string;
}

export class UpdateUserDto implements UpdateUserRequest {
  @ApiPropertyOptional() @IsOptional() @IsString() @Length(1, LIMITS.nameMax)
  name?: string;

  @ApiPropertyOptional({ enum: ROLES }) @IsOptional() @IsIn(ROLES as unknown as string[], { message: `role must be one of ${ROLES.join(', ')}` })
  role?: Role;

  @ApiPropertyOptional() @IsOptional() @IsBoolean()
  active?: boolean;
}

export class ListUsersQuery {
  @IsOptional() @Type(() => Number) @IsInt() @Min(1)
  page = 1;

  @IsOptional() @Type(() => Number) @IsInt() @Min(1) @Max(LIMITS.pageSizeMax)
  pageSize = 20;

  @IsOptional() @IsIn(ROLES as unknown as string[])
  role?: Role;

  @IsOptional() @IsString() @MaxLength(100)
  search?: string;
}

export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active,
    createdAt: u.createdAt.toISOString(),
    updatedAt: u.updatedAt.toISOString(),
  };
}
