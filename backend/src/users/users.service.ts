import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import * as bcrypt from 'bcryptjs';
import { LRUCache } from 'lru-cache';
import { Repository } from 'typeorm';
import type { Page, SessionUser, UserDto } from '@amberline/common';
import { AppException } from '../core/app-exception';
import { User } from './entities/user.entity';
import { CreateUserDto, ListUsersQuery, toUserDto, UpdateUserDto } from './dto/user.dto';

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

  constructor(@InjectRepository(User) private readonly users: Repository<User>) {}

  async list(q: ListUsersQuery): Promise<Page<UserDto>> {
    const qb = this.users.createQueryBuilder('u').orderBy('u.name', 'ASC').addOrderBy('u.id', 'ASC');
    if (q.role) qb.andWhere('u.role = :role', { role: q.role });
    if (q.search) qb.andWhere('(u.name ILIKE :s OR u.email ILIKE :s)', { s: `%${q.search.replace(/[%_\\]/g, '\\$&')}%` });
    const [rows, total] = await qb.skip((q.page - 1) * q.pageSize).take(q.pageSize).getManyAndCount();
    return { items: rows.map(toUserDto), total, page: q.page, pageSize: q.pageSize };
  }

  async create(dto: CreateUserDto): Promise<UserDto> {
    const email = dto.email.trim().toLowerCase();
    if (await this.findByEmail(email)) throw new AppException(409, 'conflict', `email: ${email} is already taken`, [{ field: 'email', reason: 'already taken' }]);
    const passwordHash = await bcrypt.hash(dto.password, BCRYPT_COST);
    const saved = await this.users.save(this.users.create({ email, name: dto.name.trim(), role: dto.role, passwordHash, active: true }));
    return toUserDto(saved);
  }

  async update(id: string, dto: UpdateUserDto, actor: SessionUser): Promise<UserDto> {
    const user = await this.get(id);
    if (actor.id === id && (dto.active === false || (dto.role && dto.role !== 'admin'))) {
      throw new AppException(409, 'conflict', 'You cannot deactivate yourself or remove your own admin role');
    }
    Object.assign(user, Object.fromEntries(Object.entries(dto).filter(([, v]) => v !== undefined)));
    const saved = await this.users.save(user);
    this.sessionUsers.delete(id);
    return toUserDto(saved);
  }

  async get(id: string): Promise<User> {
    const user = await this.users.findOneBy({ id });
    if (!user) throw new AppException(404, 'not_found', `No user ${id}`);
    return user;
  }

  findByEmail(email: string): Promise<User | null> {
    return this.users.createQueryBuilder('u').where('lower(u.email) = lower(:email)', { email }).getOne();
  }

  async activeDrivers(): Promise<{ id: string; name: string; email: string }[]> {
    const rows = await this.users.find({ where: { role: 'driver', active: true }, order: { name: 'ASC' }, take: 500 });
    return rows.map((u) => ({ id: u.id, name: u.name, email: u.email }));
  }

  /** The active user with this id as the session sees it, or null; cached briefly (see SESSION_USER_TTL_MS). */
  async sessionUser(id: string): Promise<SessionUser | null> {
    const hit = this.sessionUsers.get(id);
    if (hit !== undefined) return hit || null;
    const u = await this.users.findOneBy({ id, active: true });
    const user: SessionUser | false = u ? { id: u.id, email: u.email, name: u.name, role: u.role } : false;
    this.sessionUsers.set(id, user);
    return user || null;
  }
}
