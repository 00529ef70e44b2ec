// @vitest-environment happy-dom
/**
 * The board's whole-field edits (sketch name, sweep settings, targets, tracing): each is typed
 * by the sketch schema, replaces exactly one field, and undoes as one step. Expected values are
 * the inputs themselves or the fixture's own fields; nothing here is computed by the code under test.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import type { Sketch } from '../../../shared/schema/sketch';
import { renameSketch, setAxleEnd, setSweepSettings, setTargets, setTracing } from '../../../src/stores/board/edits';
import { useBoardStore } from '../../../src/stores/board';
import { detailOf, fourLink } from '../board/fixture';

describe('whole-field edits (pure)', () => {
  it('rename returns a new sketch with the new name and leaves its input alone', () => {
    const doc = fourLink();
    const out = renameSketch(doc, 'Workshop runabout, rear (v2)');
    expect(out.name).toBe('Workshop runabout, rear (v2)');
    expect(doc.name).toBe('Test runabout, rear');
    // Untouched parts are shared, so the history stores only the change.
    expect(out.points).toBe(doc.points);
    expect(out.sweep).toBe(doc.sweep);
  });

  it('the same value gives back the same sketch (no undo step for nothing)', () => {
    const doc = fourLink();
    expect(renameSketch(doc, doc.name)).toBe(doc);
    expect(setSweepSettings(doc, doc.sweep)).toBe(doc);
    expect(setTargets(doc, undefined)).toBe(doc);
  });

  it('targets and tracing are set, and removed with undefined', () => {
    const doc = fourLink();
    const targets: Sketch['targets'] = { antiSquat: { min: 60, max: 90 } };
    const withTargets = setTargets(doc, targets);
    expect(withTargets.targets).toEqual({ antiSquat: { min: 60, max: 90 } });
    expect('targets' in setTargets(withTargets, undefined)).toBe(false);
    const tracing: Sketch['tracing'] = {
      side: {
        upload: 'up-1',
        url: '/uploads/up-1.png',
        width: 1200,
        height: 800,
        centre: { h: 0, v: 400 },
        mmPerPx: 4,
        opacity: 0.5,
        locked: false,
      },
    };
    const withTracing = setTracing(doc, tracing);
    expect(withTracing.tracing?.side?.url).toBe('/uploads/up-1.png');
    expect('tracing' in setTracing(withTracing, undefined)).toBe(false);
    expect('tracing' in doc).toBe(false);
  });
});

describe('board store: typed whole-field edits', () => {
  let board: ReturnType<typeof useBoardStore>;
  beforeEach(() => {
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
    board.setLoaded(detailOf(fourLink()));
  });

  it('rename is one undo step named for what it did', () => {
    expect(board.rename('Runabout with longer links')).toEqual({ ok: true });
    expect(board.document!.name).toBe('Runabout with longer links');
    expect(board.undoLabel).toBe('Rename sketch');
    board.undo();
    expect(board.document!.name).toBe('Test runabout, rear');
  });

  it('sweep settings take the label they are given; a setting the schema refuses changes nothing', () => {
    const sweep = board.document!.sweep;
    expect(board.setSweepSettings({ ...sweep, axleTorque: 1500 }, { label: 'Set axle torque' }).ok).toBe(true);
    expect(board.document!.sweep.axleTorque).toBe(1500);
    expect(board.undoLabel).toBe('Set axle torque');
    const before = board.document;
    // A step of zero is outside the schema (step > 0): refused with the reason, nothing changed.
    const r = board.setSweepSettings({ ...sweep, step: 0 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/^Not changed: /);
    expect(board.document).toBe(before);
  });

  it('without a label, the undo step says which field changed', () => {
    board.setTargets({ bind: { max: 2 } });
    expect(board.undoLabel).toBe('Change targets');
    board.setSweepSettings({ ...board.document!.sweep, bump: 120 });
    expect(board.undoLabel).toBe('Change sweep');
  });

  it('a live run of tracing changes is one undo step; a named run merges too', () => {
    board.setTracing({ opacity: 0.3 }, { live: true });
    board.setTracing({ opacity: 0.4 }, { live: true });
    board.setTracing({ opacity: 0.5 }, { live: true });
    expect(board.undoLabel).toBe('Change tracing');
    board.undo();
    expect(board.canUndo).toBe(false);
    board.setTargets({ bind: { max: 1 } }, { coalesce: 'bind-limit' });
    board.setTargets({ bind: { max: 3 } }, { coalesce: 'bind-limit' });
    expect(board.document!.targets).toEqual({ bind: { max: 3 } });
    board.undo();
    expect(board.document).toEqual(fourLink());
  });

  it('removing the targets takes the field out of the document', () => {
    board.setTargets({ antiSquat: { min: 60 } });
    board.setTargets(undefined);
    expect('targets' in board.document!).toBe(false);
  });

  it('a read-only sketch refuses every whole-field edit', () => {
    board.setLoaded(detailOf(fourLink(), { canEdit: false, mine: false }));
    expect(board.rename('Mine now').ok).toBe(false);
    expect(board.setTargets({ bind: { max: 2 } }).ok).toBe(false);
    expect(board.setTracing(undefined).ok).toBe(false);
    expect(board.setSweepSettings(board.document!.sweep).ok).toBe(false);
    expect(board.document).toEqual(fourLink());
  });
});

describe('the axle end (vehicle.axle)', () => {
  beforeEach(() => setActivePinia(createPinia()));

  it('front is written; rear, the default, is never written into a file that lacks it', () => {
    const doc = fourLink();
    expect(setAxleEnd(doc, 'rear')).toBe(doc);
    const front = setAxleEnd(doc, 'front');
    expect(front.vehicle.axle).toBe('front');
    expect(front.vehicle.wheelbase).toBe(doc.vehicle.wheelbase);
    expect(front.points).toBe(doc.points);
    expect('axle' in setAxleEnd(front, 'rear').vehicle).toBe(false);
  });

  it('the board applies it as one undo step', () => {
    const board = useBoardStore();
    board.setLoaded(detailOf(fourLink()));
    const start = JSON.stringify(board.document);
    expect(board.setAxleEnd('front').ok).toBe(true);
    expect(board.document!.vehicle.axle).toBe('front');
    expect(board.undo()).toBe(true);
    expect(JSON.stringify(board.document)).toBe(start);
  });
});
