import { sharedKeys } from '../../../lib/shared-queries';
import { moveKeys } from './keys';

/** A query is refreshed by an invalidation whose key is a prefix of the query's key. */
const covers = (prefix: readonly unknown[], key: readonly unknown[]) => prefix.every((p, i) => JSON.stringify(p) === JSON.stringify(key[i]));

describe('moveKeys', () => {
  const id = 'a1b2';
  const filter = { page: 1, pageSize: 20, stage: 'requested' as const };

  it('keeps the keys the cache has always used', () => {
    expect(moveKeys.all()).toEqual(['moves']);
    expect(moveKeys.list(filter)).toEqual(['moves', 'list', filter]);
    expect(moveKeys.one(id)).toEqual(['moves', 'one', id]);
    expect(moveKeys.history(id)).toEqual(['moves', 'one', id, 'history']);
    expect(moveKeys.stageCounts()).toEqual(['moves', 'stage-counts']);
    expect(moveKeys.drivers()).toEqual(['users', 'drivers']);
  });

  it.each([
    ['list', moveKeys.list(filter)],
    ['stage counts', moveKeys.stageCounts()],
    ['one move', moveKeys.one(id)],
    ['schedule', moveKeys.schedule(id)],
    ['history', moveKeys.history(id)],
    ['assessment', moveKeys.assessment(id)],
    ['reassessment', moveKeys.reassessment(id)],
    ['preview', moveKeys.preview(null)],
  ])('a change to any move refreshes the %s', (_name, key) => {
    expect(covers(moveKeys.all(), key)).toBe(true);
  });

  it("a move's own scope covers what is read about it, not other moves", () => {
    for (const key of [moveKeys.schedule(id), moveKeys.history(id), moveKeys.assessment(id), moveKeys.reassessment(id)]) expect(covers(moveKeys.one(id), key)).toBe(true);
    expect(covers(moveKeys.one(id), moveKeys.history('other'))).toBe(false);
    expect(covers(moveKeys.one(id), moveKeys.list(filter))).toBe(false);
  });

  it('shares its roots with the other features that refresh moves and users', () => {
    expect(moveKeys.history(id)).toEqual(sharedKeys.moveHistory(id));
    expect(moveKeys.list(filter)).toEqual(sharedKeys.movesList(filter));
    expect(covers(sharedKeys.users(), moveKeys.drivers())).toBe(true);
  });

  it('tells lists with different filters apart', () => {
    expect(moveKeys.list(filter)).not.toEqual(moveKeys.list({ ...filter, page: 2 }));
  });
});
