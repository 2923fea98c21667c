import { ApiProperty, ApiPropertyOptional, PartialType, PickType } from '@nestjs/swagger';
import { IsBoolean, IsEmail, IsIn, IsOptional, IsString, Length, MaxLength } from 'class-validator';
import { LIMITS, ROLES, type CreateUserRequest, type Role, type UpdateUserRequest, type UserDto } from '@amberline/common';
import { PageQuery } from '../../core/page-query.dto';
import { Omittable } from '../../core/validators';
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

/** The fields of a change, from the create request: each may be left out (kept as it is) but not set to null. */
const CHANGEABLE = ['name', 'role'] as const;

export class UpdateUserDto
  extends PartialType(PickType(CreateUserDto, CHANGEABLE), { skipNullProperties: false })
  implements UpdateUserRequest
{
  @ApiPropertyOptional() @Omittable() @IsBoolean()
  active?: boolean;
}
// null is refused on the fields taken from the create request, as on `active` (see Omittable)
for (const field of CHANGEABLE) Omittable()(UpdateUserDto.prototype, field);

export class ListUsersQuery extends PageQuery {
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
