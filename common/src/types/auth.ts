import type { Role } from '../auth/roles';

export type UserDto = {
  id: string;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  createdAt: string;
  updatedAt: string;
};

export type SessionUser = Pick<UserDto, 'id' | 'email' | 'name' | 'role'>;

export type LoginRequest = { email: string; password: string };
export type LoginResponse = { accessToken: string; user: SessionUser };

export type CreateUserRequest = { email: string; name: string; role: Role; password: string };
export type UpdateUserRequest = { name?: string; role?: Role; active?: boolean };

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };
