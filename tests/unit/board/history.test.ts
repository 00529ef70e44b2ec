import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { History, applyChanges, deepEqual, diffDocs } from '../../../src/stores/board/history';
import { movePoints, renamePoint, setMemberKind, deleteMember } from '../../../src/stores/board/edits';
import { fourLink } from './fixture';

describe('diffDocs / applyChanges', () => {
  it('records only what differs, and both directions restore the exact documents', () => {
    const a = fourLink();
    const b = movePoints(a, new Map([['LL.fl', { x: 12.5 }]]));
    const changes = diffDocs(a, b);
    expect(changes).toEqual([{ path: ['points', 2, 'x'], before: 980, after: 992.5 }]);
    expect(applyChanges(b, changes, 'before')).toEqual(a);
    expect(applyChanges(a, changes, 'after')).toEqual(b);
  });

  it('replaces a whole object when its keys change, so key order survives an undo', () => {
    const a = fourLink();
    const b = setMemberKind(a, 'LLl', 'shock');
    const back = applyChanges(b, diffDocs(a, b), 'before');
    expect(JSON.stringify(back)).toBe(JSON.stringify(a));
  });

  it('handles arrays that change length (a deleted member)', () => {
    const a = fourLink();
    const b = deleteMember(a, 'ULl');
    expect(JSON.stringify(applyChanges(b, diffDocs(a, b), 'before'))).toBe(JSON.stringify(a));
  });

  it('never touches its input', () => {
    const a = fourLink();
    const frozen = JSON.stringify(a);
    const b = renamePoint(a, 'LL.fl', 'LowerFront.l');
    applyChanges(b, diffDocs(a, b), 'before');
    expect(JSON.stringify(a)).toBe(frozen);
  });

  it('random edit sequences undo to the exact starting document (property)', () => {
    const ids = fourLink().points.map((p) => p.id);
    const step = fc.record({
      id: fc.constantFrom(...ids),
      dx: fc.integer({ min: -50, max: 50 }),
      dz: fc.double({ min: -30, max: 30, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(step, { minLength: 1, maxLength: 25 }), (steps) => {
        const h = new History();
        const start = fourLink();
        let doc = start;
        for (const s of steps) {
          const next = movePoints(doc, new Map([[s.id, { x: s.dx, z: s.dz }]]));
          h.record('move', doc, next);
          doc = next;
        }
        while (h.canUndo) doc = h.undo(doc)!;
        return JSON.stringify(doc) === JSON.stringify(start);
      }),
    );
  });
});

describe('History', () => {
  it('undo and redo walk the same steps; a new edit clears redo', () => {
    const h = new History();
    const d0 = fourLink();
    const d1 = movePoints(d0, new Map([['UL.fl', { z: 10 }]]));
    const d2 = movePoints(d1, new Map([['UL.fl', { z: 10 }]]));
    h.record('one', d0, d1);
    h.record('two', d1, d2);
    const u1 = h.undo(d2)!;
    expect(u1).toEqual(d1);
    expect(h.redoLabel).toBe('two');
    expect(h.redo(u1)).toEqual(d2);
    h.undo(d2);
    h.record('other', d1, movePoints(d1, new Map([['UL.fl', { x: 1 }]])));
    expect(h.canRedo).toBe(false);
  });

  it('does not record a step that changes nothing', () => {
    const h = new History();
    const d = fourLink();
    expect(h.record('none', d, { ...d })).toBe(false);
    expect(h.canUndo).toBe(false);
  });

  it('merges coalesced steps that follow closely into one, from the first before to the last after', () => {
    const h = new History();
    const d0 = fourLink();
    const d1 = movePoints(d0, new Map([['UL.fl', { x: 1 }]]));
    const d2 = movePoints(d1, new Map([['UL.fl', { x: 1 }]]));
    h.record('nudge', d0, d1, { coalesce: 'k', now: 1000 });
    h.record('nudge', d1, d2, { coalesce: 'k', now: 1500 });
    expect(h.size).toBe(1);
    expect(h.undo(d2)).toEqual(d0);
  });

  it('keeps coalesced steps apart when too much time passed', () => {
    const h = new History();
    const d0 = fourLink();
    const d1 = movePoints(d0, new Map([['UL.fl', { x: 1 }]]));
    const d2 = movePoints(d1, new Map([['UL.fl', { x: 1 }]]));
    h.record('nudge', d0, d1, { coalesce: 'k', now: 1000 });
    h.record('nudge', d1, d2, { coalesce: 'k', now: 5000, windowMs: 1000 });
    expect(h.size).toBe(2);
  });

  it('drops the oldest steps beyond its limit', () => {
    const h = new History(3);
    let d = fourLink();
    for (let i = 0; i < 5; i++) {
      const n = movePoints(d, new Map([['UL.fl', { x: 1 }]]));
      h.record(`s${i}`, d, n);
      d = n;
    }
    expect(h.size).toBe(3);
  });
});

describe('deepEqual', () => {
  it('tells key order apart from content only by content', () => {
    expect(deepEqual({ a: 1, b: [1, 2] }, { a: 1, b: [1, 2] })).toBe(true);
    expect(deepEqual({ a: 1 }, { a: 2 })).toBe(false);
    expect(deepEqual([1, 2], [1, 2, 3])).toBe(false);
  });
});
