import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { User } from './entities/user.entity';
import type { UsersRepository } from './users.repository';
import { UsersService } from './users.service';

const admin: SessionUser = { id: '00000000-0000-4000-8000-00000000000a', email: 'admin@example.test', name: 'Admin', role: 'admin' };
const user = (over: Partial<User> = {}): User =>
  ({ id: admin.id, email: admin.email, name: 'Admin', role: 'admin', passwordHash: 'x', active: true, createdAt: new Date(), updatedAt: new Date(), ...over }) as User;

function setup(rows: User[]) {
  const saved: User[] = [];
  const repo = {
    find: async (id: string) => rows.find((u) => u.id === id) ?? null,
    findByEmail: async (email: string) => rows.find((u) => u.email.toLowerCase() === email.toLowerCase()) ?? null,
    build: (f: Partial<User>) => ({ id: 'new', createdAt: new Date(), updatedAt: new Date(), ...f }) as User,
    save: async (u: User) => (saved.push(u), u),
  } as unknown as UsersRepository;
  return { s: new UsersService(repo), saved };
}

describe('UsersService.update', () => {
  it.each([
    { change: { active: false }, what: 'deactivate themselves' },
    { change: { role: 'dispatcher' as const }, what: 'drop their own admin role' },
  ])('an admin may not $what', async ({ change }) => {
    const { s, saved } = setup([user()]);
    const e = await s.update(admin.id, change, admin).catch((x) => x);
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe(DOMAIN_ERRORS.SELF_LOCKOUT);
    expect(saved).toHaveLength(0);
  });

  it('an admin may rename themselves', async () => {
    const { s, saved } = setup([user()]);
    await s.update(admin.id, { name: 'New name' }, admin);
    expect(saved[0].name).toBe('New name');
  });

  it('may deactivate another admin', async () => {
    const other = user({ id: '00000000-0000-4000-8000-00000000000b', email: 'b@example.test' });
    const { s, saved } = setup([user(), other]);
    await s.update(other.id, { active: false }, admin);
    expect(saved[0].active).toBe(false);
  });

  it('a user that does not exist is not found', async () => {
    const { s } = setup([]);
    expect((await s.update('00000000-0000-4000-8000-00000000000c', { name: 'x' }, admin).catch((x) => x)).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
});

describe('UsersService.create', () => {
  it('refuses an e-mail address already taken (in any case), naming the field', async () => {
    const { s } = setup([user()]);
    const e = await s.create({ email: ' ADMIN@example.test ', name: 'Second', role: 'dispatcher', password: 'long-enough-password' }).catch((x) => x);
    expect(e.code).toBe(DOMAIN_ERRORS.ALREADY_TAKEN);
    expect(e.message).toBe('email: admin@example.test is already taken');
    expect(e.details).toEqual([{ field: 'email', reason: 'already taken' }]);
  });
});
