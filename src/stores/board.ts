import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { api, ApiError, errorMessage } from '../api/http';
import type { Revision, SketchDetail } from '../api/types';
import { checkSketch, type AxleEnd, type MemberKind, type Sketch } from '../../shared/schema/sketch';
import { unitToMm, type Mm } from '../../shared/units';
import type { Vec3 } from '../../shared/vec3';
import { History } from './board/history';
import { findPairs } from './board/pairs';
import * as edits from './board/edits';
import { snapTo, type PlanePoint, type ViewKind } from '../canvas/transform';
import { usePrefsStore } from './prefs';
import type { EditResult } from './editResult';
import { useClassesStore } from './classes';
import { handInAsSketch, handInOnBoard, type HandInOnBoard } from '../classes/handInSketch';

export type { EditResult } from './editResult';

/** Arrow-key nudges of one selection within this time (ms) undo as one step. */
export const NUDGE_COALESCE_MS = 1500;
/** Nudge step with snap off, in each display unit (Shift multiplies by NUDGE_BIG_FACTOR). */
export const FINE_NUDGE_STEP = { mm: 1, in: 0.05 } as const;
export const NUDGE_BIG_FACTOR = 10;
/** What a read-only link that was revoked (or never existed) shows in place of the board. */
export const SHARED_LINK_GONE = 'This link no longer works.';

/** The sketch's record on the server, without its document. */
export type SketchMeta = Omit<SketchDetail, 'document'>;

export interface RevisionDetail extends Revision {
  document: Sketch;
}

/**
 * How a whole-field edit joins the undo history: `live` (a photo being moved, a slider held)
 * merges a run of quick changes to the same field into one step; `coalesce` names such a run
 * explicitly; `label` is the undo menu's words.
 */
export interface FieldEditOptions {
  live?: boolean;
  coalesce?: string;
  label?: string;
}

/** The sketch's record without its document. */
function stripDocument(detail: SketchDetail): SketchMeta {
  const { document: _doc, ...rest } = detail;
  return rest;
}

interface DragState {
  view: ViewKind;
  /** the pivot under the pointer; snapping applies to it */
  grabbed: string;
  ids: string[];
  start: Sketch;
}

/**
 * The board: the sketch being edited (exchange-format shape, plain data), the selection, the
 * mirror setting, the undo history and the typed edits. The only place edits are applied:
 * components call these actions. Saving lives in useBoardSaveStore (which follows
 * `changeCount` and `loadCount`; the board page starts it with the board) and revisions in
 * useRevisionsStore; snap is a preference (usePrefsStore).
 *
 * Documents are immutable: every edit builds a new one sharing untouched parts, so history
 * stores inverse changes only and undo restores the exact earlier document.
 */
export const useBoardStore = defineStore('board', () => {
  const prefs = usePrefsStore();

  // ---- what is loaded -------------------------------------------------------------
  const meta = ref<SketchMeta | null>(null);
  /** Set when the sketch came through a read-only link. */
  const sharedToken = ref<string | null>(null);
  /** Set when the board shows a hand-in (read-only, the version the student handed in). */
  const handIn = ref<HandInOnBoard | null>(null);
  /** The working document. */
  const document = shallowRef<Sketch | null>(null);
  /** A revision opened read-only, shown instead of the working document. */
  const viewing = shallowRef<RevisionDetail | null>(null);
  const loading = ref(false);
  const loadError = ref<string | null>(null);

  /** The document the board shows (a revision while one is open). The sweep runs on this. */
  const sketch = computed<Sketch | null>(() => viewing.value?.document ?? document.value);
  const canEdit = computed(() => meta.value?.canEdit === true && sharedToken.value === null);
  const readOnly = computed(() => !canEdit.value || viewing.value !== null);
  const sketchId = computed(() => meta.value?.id ?? null);
  /**
   * Left/right partners of the shown document's pivots. The same Map while the pairing is the
   * same, so that a drag (which rarely changes it) does not refresh everything that reads it.
   */
  let lastPairs: { key: string; map: Map<string, string> } = { key: '', map: new Map() };
  const pairs = computed(() => {
    const map = findPairs(sketch.value?.points ?? []);
    const key = [...map].map(([a, b]) => `${a}>${b}`).join('|');
    if (key !== lastPairs.key) lastPairs = { key, map };
    return lastPairs.map;
  });
  /** Validation of the working document (problems block saving, never editing). */
  const problems = computed<string[]>(() => {
    if (!document.value) return [];
    const res = checkSketch(document.value);
    return res.ok ? [] : res.problems;
  });

  // ---- signals for saving and revisions --------------------------------------------------
  /** Counts the user's changes to the working document (an edit, undo, redo, a finished drag): autosave follows it. */
  const changeCount = ref(0);
  /** Counts sketches put on the board: what belonged to the previous one (save state, revision list) resets. */
  const loadCount = ref(0);

  // ---- selection and settings -------------------------------------------------------
  const selectedPoints = ref<string[]>([]);
  const selectedMember = ref<string | null>(null);
  const mirrorLinked = ref(true);

  function setMirrorLinked(on: boolean) {
    mirrorLinked.value = on;
  }

  /** Selects a member or pivot by id (members first: a flag names a member); null clears. */
  function select(id: string | null, opts: { add?: boolean } = {}) {
    const doc = sketch.value;
    if (id === null || !doc) {
      selectedPoints.value = [];
      selectedMember.value = null;
      return;
    }
    if (doc.members.some((m) => m.id === id)) {
      selectedMember.value = id;
      selectedPoints.value = [];
      return;
    }
    if (!doc.points.some((p) => p.id === id)) return;
    selectedMember.value = null;
    if (opts.add) {
      selectedPoints.value = selectedPoints.value.includes(id)
        ? selectedPoints.value.filter((p) => p !== id)
        : [...selectedPoints.value, id];
    } else selectedPoints.value = [id];
  }

  function pruneSelection() {
    const doc = sketch.value;
    if (!doc) return;
    const points = new Set(doc.points.map((p) => p.id));
    selectedPoints.value = selectedPoints.value.filter((id) => points.has(id));
    if (selectedMember.value && !doc.members.some((m) => m.id === selectedMember.value)) selectedMember.value = null;
  }

  // ---- history ----------------------------------------------------------------------
  const history = new History();
  /** Bumped whenever the history changes, so getters over it stay reactive. */
  const historyTick = ref(0);
  const canUndo = computed(() => (historyTick.value, history.canUndo && !readOnly.value));
  const canRedo = computed(() => (historyTick.value, history.canRedo && !readOnly.value));
  const undoLabel = computed(() => (historyTick.value, history.undoLabel));
  const redoLabel = computed(() => (historyTick.value, history.redoLabel));

  let drag: DragState | null = null;
  const dragging = ref(false);
  /** The view the drag is in (its tooltip shows there only). */
  const dragView = ref<ViewKind | null>(null);

  function mirrorPairs(): ReadonlyMap<string, string> | undefined {
    return mirrorLinked.value ? pairs.value : undefined;
  }

  /**
   * Applies one edit as one undo step. The edit is refused, and nothing changes, when the board
   * is read-only, when the edit itself fails, or when it would turn a valid sketch into an
   * invalid one (the message names the problem).
   */
  function commit(
    label: string,
    edit: (doc: Sketch) => Sketch,
    opts: { coalesce?: string; windowMs?: number } = {},
  ): EditResult {
    const before = document.value;
    if (!before) return { ok: false, error: 'No sketch is open.' };
    if (readOnly.value)
      return {
        ok: false,
        error: viewing.value
          ? 'A revision is open read-only; go back to the current sketch to edit.'
          : 'This sketch is read-only.',
      };
    if (drag) endDrag();
    let after: Sketch;
    try {
      after = edit(before);
    } catch (err) {
      if (err instanceof edits.BoardEditError) return { ok: false, error: err.message };
      throw err;
    }
    if (after === before) return { ok: true };
    if (problems.value.length === 0) {
      const check = checkSketch(after);
      if (!check.ok) return { ok: false, error: `Not changed: ${check.problems.slice(0, 2).join('; ')}` };
    }
    if (!history.record(label, before, after, opts)) return { ok: true };
    historyTick.value++;
    document.value = after;
    pruneSelection();
    changeCount.value++;
    return { ok: true };
  }

  function undo(): boolean {
    if (!document.value || readOnly.value) return false;
    if (drag) endDrag();
    const prev = history.undo(document.value);
    if (!prev) return false;
    historyTick.value++;
    document.value = prev;
    pruneSelection();
    changeCount.value++;
    return true;
  }

  function redo(): boolean {
    if (!document.value || readOnly.value) return false;
    if (drag) endDrag();
    const next = history.redo(document.value);
    if (!next) return false;
    historyTick.value++;
    document.value = next;
    pruneSelection();
    changeCount.value++;
    return true;
  }

  // ---- edits ------------------------------------------------------------------------
  function setPointCoordinate(id: string, axis: edits.Axis, value: Mm): EditResult {
    return commit(`Set ${id}.${axis}`, (d) => edits.setPointCoordinate(d, id, axis, value, mirrorPairs()));
  }
  /** Puts pivots at the positions of an imported hardpoint table (mm), as one undo step. */
  function placePoints(positions: ReadonlyMap<string, Vec3>, label: string): EditResult {
    return commit(label, (d) => edits.placePoints(d, positions));
  }
  function renamePoint(from: string, to: string): EditResult {
    const r = commit(`Rename ${from} to ${to}`, (d) => edits.renamePoint(d, from, to));
    if (r.ok) selectedPoints.value = selectedPoints.value.map((p) => (p === from ? to : p));
    return r;
  }
  function renameMember(from: string, to: string): EditResult {
    const r = commit(`Rename ${from} to ${to}`, (d) => edits.renameMember(d, from, to));
    if (r.ok && selectedMember.value === from) selectedMember.value = to;
    return r;
  }
  function setMemberKind(id: string, kind: MemberKind): EditResult {
    return commit(`Make ${id} a ${kind}`, (d) => edits.setMemberKind(d, id, kind));
  }
  function setMemberEnds(id: string, a: string, b: string): EditResult {
    return commit(`Reconnect ${id}`, (d) => edits.setMemberEnds(d, id, a, b));
  }
  function setMemberField(id: string, field: edits.MemberField, value: number | string | undefined): EditResult {
    return commit(`Set ${id} ${field}`, (d) => edits.setMemberField(d, id, field, value));
  }
  function addMember(member: edits.Member, newPoints: edits.Point[] = []): EditResult {
    const r = commit(`Add ${member.id}`, (d) => edits.addMember(d, member, newPoints));
    if (r.ok) select(member.id);
    return r;
  }
  function deleteMember(id: string): EditResult {
    return commit(`Delete ${id}`, (d) => edits.deleteMember(d, id));
  }
  function addPoint(point: edits.Point): EditResult {
    const r = commit(`Add ${point.id}`, (d) => edits.addPoint(d, point));
    if (r.ok) select(point.id);
    return r;
  }
  function deletePoint(id: string): EditResult {
    return commit(`Delete ${id}`, (d) => edits.deletePoint(d, id));
  }
  function setVehicleField(field: edits.VehicleField, value: Mm): EditResult {
    return commit(`Set ${field}`, (d) => edits.setVehicleField(d, field, value));
  }

  /** Puts a solid axle at the front or the rear of the vehicle (`vehicle.axle`). */
  function setAxleEnd(end: AxleEnd): EditResult {
    return commit(`Axle at the ${end}`, (d) => edits.setAxleEnd(d, end));
  }
  /** Renames the sketch. */
  function rename(name: string): EditResult {
    return commit('Rename sketch', (d) => edits.renameSketch(d, name));
  }
  /** One whole-field edit as one undo step; see FieldEditOptions for how runs of them merge. */
  function commitField(key: string, edit: (doc: Sketch) => Sketch, opts: FieldEditOptions): EditResult {
    const coalesce = opts.coalesce ?? (opts.live ? `field:${key}` : undefined);
    return commit(opts.label ?? `Change ${key}`, edit, { coalesce, windowMs: NUDGE_COALESCE_MS });
  }
  /** Replaces the sweep settings (ranges, steps, flag limits, loads). */
  function setSweepSettings(sweep: Sketch['sweep'], opts: FieldEditOptions = {}): EditResult {
    return commitField('sweep', (d) => edits.setSweepSettings(d, sweep), opts);
  }
  /** Replaces the designer's target bands; `undefined` removes them. */
  function setTargets(targets: Sketch['targets'], opts: FieldEditOptions = {}): EditResult {
    return commitField('targets', (d) => edits.setTargets(d, targets), opts);
  }
  /** Replaces the photos behind the views; `undefined` removes them. */
  function setTracing(tracing: Sketch['tracing'], opts: FieldEditOptions = {}): EditResult {
    return commitField('tracing', (d) => edits.setTracing(d, tracing), opts);
  }

  /**
   * Nudges the selected pivots in a view's plane by whole steps: `dh` to the screen's right is
   * negative h (both views draw +h to the left), `dv` up is +z. Repeated nudges undo as one.
   */
  function nudge(view: ViewKind, right: number, up: number, big = false): EditResult {
    const ids = selectedPoints.value;
    if (ids.length === 0) return { ok: false, error: 'Select a pivot to nudge.' };
    const base = prefs.snapOn ? prefs.snapStep : FINE_NUDGE_STEP[prefs.units];
    const stepMm = unitToMm(base, prefs.units) * (big ? NUDGE_BIG_FACTOR : 1);
    const dh = -right * stepMm;
    const dv = up * stepMm;
    const delta: edits.Delta = view === 'side' ? { x: dh, z: dv } : { y: dh, z: dv };
    return commit(
      ids.length === 1 ? `Nudge ${ids[0]}` : `Nudge ${ids.length} pivots`,
      (d) => edits.movePoints(d, new Map(ids.map((id) => [id, delta])), mirrorPairs()),
      { coalesce: `nudge:${view}:${ids.join(',')}`, windowMs: NUDGE_COALESCE_MS },
    );
  }

  // ---- dragging: live updates, one undo step at the end --------------------------------
  /** Starts dragging `grabbed` (and the rest of the selection if it is part of it). */
  function beginDrag(view: ViewKind, grabbed: string): boolean {
    const doc = document.value;
    if (!doc || readOnly.value || !doc.points.some((p) => p.id === grabbed)) return false;
    if (drag) endDrag();
    if (!selectedPoints.value.includes(grabbed)) select(grabbed);
    drag = { view, grabbed, ids: [...selectedPoints.value], start: doc };
    dragging.value = true;
    dragView.value = view;
    return true;
  }

  /** Moves the grabbed pivot to plane position `target` (mm, snapped if snap is on); the others follow. */
  function dragTo(target: PlanePoint) {
    if (!drag || !document.value) return;
    const start = drag.start.points.find((p) => p.id === drag!.grabbed);
    if (!start) return;
    const step = prefs.snapOn ? prefs.snapStepMm : 0;
    const h = step ? snapTo(target.h, step) : target.h;
    const v = step ? snapTo(target.v, step) : target.v;
    const delta: edits.Delta =
      drag.view === 'side' ? { x: h - start.x, z: v - start.z } : { y: h - start.y, z: v - start.z };
    // Always from the drag's start: no drift from rounding, and snapping can move a pivot back.
    document.value = edits.movePoints(drag.start, new Map(drag.ids.map((id) => [id, delta])), mirrorPairs());
  }

  /** Ends the drag, recording it as one undo step when anything moved. */
  function endDrag() {
    if (!drag) return;
    const { start, ids } = drag;
    stopDrag();
    const end = document.value;
    if (!end || end === start) return;
    const label = ids.length === 1 ? `Move ${ids[0]}` : `Move ${ids.length} pivots`;
    if (history.record(label, start, end)) {
      historyTick.value++;
      changeCount.value++;
    }
  }

  /** Forgets the drag without recording anything. */
  function stopDrag() {
    drag = null;
    dragging.value = false;
    dragView.value = null;
  }

  /** Abandons the drag (Escape): back to where it started, nothing recorded. */
  function cancelDrag() {
    if (!drag) return;
    document.value = drag.start;
    stopDrag();
  }

  // ---- loading ----------------------------------------------------------------------
  /** Puts a sketch from the server on the board, forgetting the previous one. */
  function setLoaded(detail: SketchDetail, token: string | null = null) {
    stopDrag();
    history.clear();
    historyTick.value++;
    meta.value = stripDocument(detail);
    sharedToken.value = token;
    handIn.value = null;
    document.value = detail.document;
    viewing.value = null;
    loadError.value = null;
    selectedPoints.value = [];
    selectedMember.value = null;
    loadCount.value++;
  }

  async function load(url: string, token: string | null) {
    loading.value = true;
    loadError.value = null;
    try {
      setLoaded(await api.get<SketchDetail>(url), token);
    } catch (err) {
      document.value = null;
      meta.value = null;
      const missing = err instanceof ApiError && err.status === 404;
      loadError.value = !missing
        ? errorMessage(err)
        : token !== null
          ? SHARED_LINK_GONE
          : 'This sketch does not exist, or is not shared with you.';
    } finally {
      loading.value = false;
    }
  }

  const loadSketch = (id: number) => load(`/api/sketches/${id}`, null);
  const loadShared = (token: string) => load(`/api/shared/${encodeURIComponent(token)}`, token);

  /** Opens a hand-in read-only: the frozen version, under the student's name and the assignment's title. */
  async function loadHandIn(id: number) {
    loading.value = true;
    loadError.value = null;
    try {
      const h = await useClassesStore().fetchHandIn(id);
      setLoaded(handInAsSketch(h));
      handIn.value = handInOnBoard(h);
    } catch (err) {
      document.value = null;
      meta.value = null;
      handIn.value = null;
      const missing = err instanceof ApiError && (err.status === 404 || err.status === 403);
      loadError.value = missing ? 'This hand-in does not exist, or is not yours to see.' : errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  // ---- what the server answers while the sketch is open -----------------------------------
  /** Takes the server's record of the sketch (its version after a save) without touching the document. */
  function setMeta(detail: SketchDetail) {
    meta.value = stripDocument(detail);
  }

  /**
   * Puts the server's document in place of the working one (the saved version after a conflict,
   * a restored revision). The step is recorded for undo, so the user's own document is one
   * Ctrl+Z away and never lost. `closeRevision` leaves a revision that is open read-only.
   */
  function adoptServerDocument(detail: SketchDetail, label: string, opts: { closeRevision?: boolean } = {}) {
    const mine = document.value;
    meta.value = stripDocument(detail);
    if (mine && history.record(label, mine, detail.document)) historyTick.value++;
    document.value = detail.document;
    if (opts.closeRevision) viewing.value = null;
    pruneSelection();
  }

  /** Shows a revision read-only in place of the working document (which stays as it is); null goes back. */
  function showRevision(revision: RevisionDetail | null) {
    viewing.value = revision;
    pruneSelection();
  }

  /** Leaves the board: forgets a drag in progress (the save store stops its own timer). */
  function dispose() {
    stopDrag();
  }

  return {
    // state
    meta,
    sharedToken,
    handIn,
    document,
    viewing,
    loading,
    loadError,
    sketch,
    canEdit,
    readOnly,
    sketchId,
    pairs,
    problems,
    selectedPoints,
    selectedMember,
    mirrorLinked,
    dragging,
    dragView,
    canUndo,
    canRedo,
    undoLabel,
    redoLabel,
    changeCount,
    loadCount,
    // actions
    select,
    setMirrorLinked,
    commit,
    undo,
    redo,
    setPointCoordinate,
    placePoints,
    renamePoint,
    renameMember,
    setMemberKind,
    setMemberEnds,
    setMemberField,
    addMember,
    deleteMember,
    addPoint,
    deletePoint,
    setVehicleField,
    setAxleEnd,
    rename,
    setSweepSettings,
    setTargets,
    setTracing,
    nudge,
    beginDrag,
    dragTo,
    endDrag,
    cancelDrag,
    setLoaded,
    loadSketch,
    loadShared,
    loadHandIn,
    setMeta,
    adoptServerDocument,
    showRevision,
    dispose,
  };
});
