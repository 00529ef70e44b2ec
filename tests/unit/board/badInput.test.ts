// @vitest-environment happy-dom
/**
 * The board refuses the same bad inputs as the schema, the API and the command line: every board edit goes through
 * the store's commit, which checks the edited sketch with checkSketch and refuses (changing nothing) with the
 * problem checkSketch names.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useBoardStore } from '../../../src/stores/board';
import { setDrivelineSettings } from '../../../src/stores/board/edits';
import { starters } from '../../../shared/kinematics';
import type { Sketch } from '../../../shared/schema/sketch';
import { badInputCases } from '../schema/badInputCases';
import { detailOf, fourLink } from './fixture';

const problemOf = (name: string) => badInputCases.find((c) => c.name === name)!.problem;

describe('board: bad inputs are refused with the field named, changing nothing', () => {
  let board: ReturnType<typeof useBoardStore>;
  const open = (doc: Sketch) => {
    board.setLoaded(detailOf(doc));
    expect(board.problems).toEqual([]);
  };
  const refuses = (r: { ok: boolean; error?: string }, before: Sketch | null, name: string) => {
    expect(r.ok).toBe(false);
    expect(r.error).toContain(problemOf(name));
    expect(board.document).toBe(before);
  };
  beforeEach(() => {
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
  });

  it('deleting an arm’s hinge or its ball joint', () => {
    open(starters['double-wishbone']!.build());
    const before = board.document;
    refuses(board.deleteMember('LWl'), before, 'an arm body without its hinge (its two frame pivots)');
    refuses(board.deleteMember('UBJr'), before, 'an arm body without its ball joint');
  });

  it('moving a hinge pivot off the frame, or a member’s end onto the other side', () => {
    open(starters['double-wishbone']!.build());
    const before = board.document;
    refuses(board.setMemberEnds('UWr', 'UW.f.r', 'UW.bj.r'), before, "an arm body's hinge with a pivot off the frame");
    refuses(board.setMemberEnds('SPl', 'TR.o.r', 'CO.b.l'), before, 'a member ending on an arm of the other side');
  });

  it('slip-yoke limits in the wrong order and a negative minimum joint angle', () => {
    open(fourLink());
    const before = board.document;
    refuses(
      board.commit('Set slip-yoke limits', (d) =>
        setDrivelineSettings(d, { slipYoke: { collapsed: 1500, extended: 1300 } }),
      ),
      before,
      'slip-yoke limits in the wrong order',
    );
    refuses(
      board.commit('Set minimum joint angle', (d) => setDrivelineSettings(d, { minJointAngle: -0.5 })),
      before,
      'a negative minimum joint angle',
    );
  });
});
