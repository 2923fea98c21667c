import { Injectable } from '@nestjs/common';
import * as bcrypt from 'bcryptjs';
import { LRUCache } from 'lru-cache';
import { DOMAIN_ERRORS, DomainError, type Page, type SessionUser, type UserDto } from '@amberline/common';
import type { User } from './entities/user.entity';
import { CreateUserDto, ListUsersQuery, toUserDto, UpdateUserDto } from './dto/user.dto';
import { UsersRepository } from './users.repository';

export const BCRYPT_COST = 12;

/**
 * How long a signed-in user's record is reused without asking the database again. Every change made through
 * this service drops the user's entry at once, so in one server process a deactivation or a role change takes
 * effect on the next request; another process (a second server behind a balancer) sees it within this time.
 */
export const SESSION_USER_TTL_MS = 5_000;

@Injectable()
export class UsersService {
  /** Active users by id, for the check every authenticated request makes (see SESSION_USER_TTL_MS). */
  private readonly sessionUsers = new LRUCache<string, SessionUser | false>({ max: 5_000, ttl: SESSION_USER_TTL_MS });

  constructor(private readonly repo: UsersRepository) {}

  async list(q: ListUsersQuery): Promise<Page<UserDto>> {
    const { rows, total } = await this.repo.page(q, q.page, q.pageSize);
    return { items: rows.map(toUserDto), total, page: q.page, pageSize: q.pageSize };
  }

  async create(dto: CreateUserDto): Promise<UserDto> {
    const email = dto.email.trim().toLowerCase();
    if (await this.findByEmail(email)) throw new DomainError(DOMAIN_ERRORS.ALREADY_TAKEN, `email: ${email} is already taken`, [{ field: 'email', reason: 'already taken' }]);
    const passwordHash = await bcrypt.hash(dto.password, BCRYPT_COST);
    const saved = await this.repo.save(this.repo.build({ email, name: dto.name.trim(), role: dto.role, passwordHash, active: true }));
    return toUserDto(saved);
  }

  async update(id: string, dto: UpdateUserDto, actor: SessionUser): Promise<UserDto> {
    const user = await this.get(id);
    if (actor.id === id && (dto.active === false || (dto.role && dto.role !== 'admin'))) {
      throw new DomainError(DOMAIN_ERRORS.SELF_LOCKOUT, 'You cannot deactivate yourself or remove your own admin role');
    }
    Object.assign(user, Object.fromEntries(Object.entries(dto).filter(([, v]) => v !== undefined)));
    const saved = await this.repo.save(user);
    this.sessionUsers.delete(id);
    return toUserDto(saved);
  }

  async get(id: string): Promise<User> {
    const user = await this.repo.find(id);
    if (!user) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No user ${id}`);
    return user;
  }

  findByEmail(email: string): Promise<User | null> {
    return this.repo.findByEmail(email);
  }

  async activeDrivers(): Promise<{ id: string; name: string; email: string }[]> {
    const rows = await this.repo.activeDrivers(500);
    return rows.map((u) => ({ id: u.id, name: u.name, email: u.email }));
  }

  /** The active user with this id as the session sees it, or null; cached briefly (see SESSION_USER_TTL_MS). */
  async sessionUser(id: string): Promise<SessionUser | null> {
    const hit = this.sessionUsers.get(id);
    if (hit !== undefined) return hit || null;
    const u = await this.repo.findActive(id);
    const user: SessionUser | false = u ? { id: u.id, email: u.email, name: u.name, role: u.role } : false;
    this.sessionUsers.set(id, user);
    return user || null;
  }
}
