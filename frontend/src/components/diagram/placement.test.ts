import type { MarkingsResult } from '@amberline/common';
import { extremesOf, pieceAt, placeMarking, placeMarkings, spotLateral, spotX, type DrawnPiece } from './placement';

const one = { index: 0, count: 1, projecting: [] as ('left' | 'right')[] };

describe('placeMarking reads every wording the markings use', () => {
  it.each([
    // 49 CFR 393.87 as the engine words it
    ['left, front extremity of the projection', one, [{ along: 'front', side: 'left', on: 'projection' }]],
    ['right, rear extremity of the projection', one, [{ along: 'rear', side: 'right', on: 'projection' }]],
    ['projecting side, rear extremity of the projection', { ...one, projecting: ['right'] as ('left' | 'right')[] }, [{ along: 'rear', side: 'right', on: 'projection' }]],
    ['projecting side, front extremity of the projection', one, [{ along: 'front', side: 'left', on: 'projection' }, { along: 'front', side: 'right', on: 'projection' }]],
    ['extreme rear of the load', one, [{ along: 'rear', side: 'center', on: 'load' }]],
    ['extreme rear of the load, left edge (marks the maximum width)', one, [{ along: 'rear', side: 'left', on: 'load' }]],
    // 49 CFR 393.11 lamps
    ['front of the side projection', { ...one, projecting: ['left'] as ('left' | 'right')[] }, [{ along: 'front', side: 'left', on: 'projection' }]],
    // rulebook flag kinds
    ['front right corner', one, [{ along: 'front', side: 'right', on: 'load' }]],
    ['rear left corner', one, [{ along: 'rear', side: 'left', on: 'load' }]],
    ['widest extremity, flag 2 (2–4)', { ...one, index: 1, count: 2 }, [{ along: 'middle', side: 'right', on: 'load' }]],
    ['end of the overhang, flag 1', one, [{ along: 'rear', side: 'center', on: 'load' }]],
    ['end of the overhang, flag 1', { ...one, count: 2 }, [{ along: 'rear', side: 'left', on: 'load' }]],
    ['end of the front overhang', one, [{ along: 'front', side: 'center', on: 'load' }]],
    ['each side of the projecting load (one per side, marking maximum overhang)', one, [{ along: 'middle', side: 'left', on: 'projection' }, { along: 'middle', side: 'right', on: 'projection' }]],
    // rulebook sign and lamp positions
    ['front of the vehicle', one, [{ along: 'front', side: 'center', on: 'vehicle' }]],
    ['front of vehicle', one, [{ along: 'front', side: 'center', on: 'vehicle' }]],
    ['front of the power unit', one, [{ along: 'front', side: 'center', on: 'vehicle' }]],
    ['rear of the towed unit or rear of the load', one, [{ along: 'rear', side: 'center', on: 'vehicle' }]],
    ['rear of the load (or rear of the vehicle if a sign on the load would not be easily read)', one, [{ along: 'rear', side: 'center', on: 'load' }]],
    ['rear of the projecting load, one at each side', { ...one, count: 2 }, [{ along: 'rear', side: 'left', on: 'load' }, { along: 'rear', side: 'right', on: 'load' }]],
    ['front', one, [{ along: 'front', side: 'center', on: 'load' }]],
    ['rear', one, [{ along: 'rear', side: 'center', on: 'load' }]],
  ])('%s', (position, ctx, spots) => {
    expect(placeMarking(position, ctx)).toEqual(spots);
  });

  it.each(['each escort vehicle', 'above the roof of the cab of the power unit', 'power unit, at each end of the oversize load sign', 'end of the load'])(
    'names no place on the drawing: %s',
    (position) => expect(placeMarking(position, one)).toEqual([]),
  );

  it('does not read "rear" inside another word', () => {
    expect(placeMarking('rearview mirror', one)).toEqual([]);
  });
});

const piece = (id: string, x0: number, x1: number, y0: number, y1: number): DrawnPiece => ({ id, x0, x1, y0, y1, deck: 40, bottom: 44, top: 150 });

describe('where a spot lands on the pieces', () => {
  const front = piece('A', 100, 300, -60, 60);
  const wide = piece('B', 320, 500, -90, 70);
  const ex = extremesOf([front, wide])!;

  it('finds the pieces at each end and edge', () => {
    expect(ex.front.id).toBe('A');
    expect(ex.rear.id).toBe('B');
    expect(ex.leftmost.id).toBe('B');
    expect(ex.rightmost.id).toBe('B');
    expect(extremesOf([])).toBeNull();
  });

  it('puts a front corner on the front piece, a projection on the piece that projects', () => {
    const corner = { along: 'front', side: 'left', on: 'load' } as const;
    expect(pieceAt(corner, ex).id).toBe('A');
    expect([spotX(corner, front), spotLateral(corner, front)]).toEqual([100, -60]);
    const projection = { along: 'front', side: 'left', on: 'projection' } as const;
    expect(pieceAt(projection, ex).id).toBe('B');
    const middle = { along: 'middle', side: 'center', on: 'load' } as const;
    expect([spotX(middle, wide), spotLateral(middle, wide)]).toEqual([410, -10]);
  });
});

describe('placeMarkings', () => {
  const markings = {
    flags: [
      { position: 'end of the overhang, flag 1', minSquareIn: 18, colors: 'red', reason: 'r', source: 's' },
      { position: 'end of the overhang, flag 2', minSquareIn: 18, colors: 'red', reason: 'r', source: 's' },
    ],
    lamps: [{ position: 'rear of the side projection', color: 'red', count: 1, reason: 'r', source: 's' }],
    signs: [{ text: 'OVERSIZE LOAD', position: 'front of the vehicle', minWidthIn: 84, minHeightIn: 18, letterHeightIn: 10, colors: 'black on yellow', reason: 'r', source: 's' }],
    reflectors: [],
    escortSigns: [],
  } as unknown as MarkingsResult;

  it('shares numbered flags of one wording between the two sides and places lamps and signs', () => {
    const marks = placeMarkings(markings, [piece('A', 0, 400, -70, 80)], ['right']);
    expect(marks.map((m) => [m.kind, m.spot.along, m.spot.side, m.spot.on])).toEqual([
      ['flag', 'rear', 'left', 'load'],
      ['flag', 'rear', 'right', 'load'],
      ['lamp-red', 'rear', 'right', 'projection'],
      ['sign', 'front', 'center', 'vehicle'],
    ]);
  });

  it('places nothing on a drawing with no pieces', () => {
    expect(placeMarkings(markings, [], [])).toEqual([]);
  });
});
