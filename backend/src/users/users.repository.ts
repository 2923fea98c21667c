import { Injectable } from '@nestjs/common';
import { DataSource } from 'typeorm';
import type { Role } from '@amberline/common';
import { User } from './entities/user.entity';

export type UserFilter = { role?: Role; search?: string };

/** Users' rows (other modules read people through here or UsersService, not through the entity). */
@Injectable()
export class UsersRepository {
  constructor(private readonly ds: DataSource) {}

  async page(q: UserFilter, page: number, pageSize: number): Promise<{ rows: User[]; total: number }> {
    const qb = this.ds.manager.createQueryBuilder(User, 'u').orderBy('u.name', 'ASC').addOrderBy('u.id', 'ASC');
    if (q.role) qb.andWhere('u.role = :role', { role: q.role });
    if (q.search) qb.andWhere('(u.name ILIKE :s OR u.email ILIKE :s)', { s: `%${q.search.replace(/[%_\\]/g, '\\$&')}%` });
    const [rows, total] = await qb.skip((page - 1) * pageSize).take(pageSize).getManyAndCount();
    return { rows, total };
  }

  find(id: string): Promise<User | null> {
    return this.ds.manager.findOneBy(User, { id });
  }

  findActive(id: string): Promise<User | null> {
    return this.ds.manager.findOneBy(User, { id, active: true });
  }

  /** The user with this e-mail address, in any case. */
  findByEmail(email: string): Promise<User | null> {
    return this.ds.manager.createQueryBuilder(User, 'u').where('lower(u.email) = lower(:email)', { email }).getOne();
  }

  activeDrivers(limit: number): Promise<User[]> {
    return this.ds.manager.find(User, { where: { role: 'driver', active: true }, order: { name: 'ASC' }, take: limit });
  }

  build(fields: Partial<User>): User {
    return this.ds.manager.create(User, fields);
  }

  save(u: User): Promise<User> {
    return this.ds.manager.save(u);
  }
}
