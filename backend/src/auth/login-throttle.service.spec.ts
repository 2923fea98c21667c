import { Test } from '@nestjs/testing';
import { LoginThrottleRepository } from './login-throttle.repository';
import { LoginThrottleService, MAX_FAILURES_PER_MINUTE } from './login-throttle.service';

async function setup(counts: { byEmail: number; byIp: number }) {
  const repo = { recentFailures: jest.fn(async () => counts), insertFailure: jest.fn(), pruneOlderThanAnHour: jest.fn() };
  const mod = await Test.createTestingModule({ providers: [LoginThrottleService, { provide: LoginThrottleRepository, useValue: repo }] }).compile();
  return { throttle: mod.get(LoginThrottleService), repo };
}

describe('LoginThrottleService', () => {
  // the limit is the product's own (10 failures a minute per e-mail or per address), common practice, no published source
  it.each([
    ['under the limit on both counts', { byEmail: MAX_FAILURES_PER_MINUTE - 1, byIp: MAX_FAILURES_PER_MINUTE - 1 }, false],
    ['the e-mail at the limit', { byEmail: MAX_FAILURES_PER_MINUTE, byIp: 0 }, true],
    ['the address at the limit (many e-mails tried from one place)', { byEmail: 1, byIp: MAX_FAILURES_PER_MINUTE }, true],
  ])('%s', async (_name, counts, blocked) => {
    const { throttle, repo } = await setup(counts);
    expect(await throttle.isBlocked('a@example.com', '10.0.0.1')).toBe(blocked);
    expect(repo.recentFailures).toHaveBeenCalledWith('a@example.com', '10.0.0.1');
  });

  it('records a failure and prunes the ones that no longer count', async () => {
    const { throttle, repo } = await setup({ byEmail: 0, byIp: 0 });
    await throttle.recordFailure('a@example.com', '10.0.0.1');
    expect(repo.insertFailure).toHaveBeenCalledWith('a@example.com', '10.0.0.1');
    expect(repo.pruneOlderThanAnHour).toHaveBeenCalled();
  });
});
