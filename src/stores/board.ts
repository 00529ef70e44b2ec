import { defineStore } from 'pinia';
import { computed, ref, shallowRef } from 'vue';
import { api, ApiError, errorMessage } from '../api/http';
import type { Revision, SketchDetail } from '../api/types';
import { checkSketch, type Layout, type MemberKind, type Sketch } from '../../shared/schema/sketch';
import { unitToMm, type Mm } from '../../shared/units';
import { starters } from '../../shared/kinematics/starters';
import { History, deepEqual } from './board/history';
import { findPairs } from './board/pairs';
import * as edits from './board/edits';
import { compareSketches, type SketchComparison } from './board/compare';
import { snapTo, type PlanePoint, type ViewKind } from '../canvas/transform';
import { usePrefsStore } from './prefs';

/** Quiet time after the last edit before the sketch is saved (ms): long enough to finish typing a number. */
export const AUTOSAVE_DELAY_MS = 1200;
/** Arrow-key nudges of one selection within this time (ms) undo as one step. */
export const NUDGE_COALESCE_MS = 1500;
/** Snap and nudge steps a new user starts with, in each display unit. */
export const DEFAULT_SNAP_STEP = { mm: 5, in: 0.25 } as const;
/** Nudge step with snap off, in each display unit (Shift multiplies by NUDGE_BIG_FACTOR). */
export const FINE_NUDGE_STEP = { mm: 1, in: 0.05 } as const;
export const NUDGE_BIG_FACTOR = 10;

const SNAP_KEY = 'arcwright.board.snap';

export type SaveState = 'saved' | 'saving' | 'unsaved' | 'error' | 'conflict';
export type EditResult = { ok: true } | { ok: false; error: string };

/** The sketch's record on the server, without its document. */
export type SketchMeta = Omit<SketchDetail, 'document'>;

export interface RevisionDetail extends Revision {
  document: Sketch;
}

interface SnapSettings {
  on: boolean;
  step: { mm: number; in: number };
}

function readSnap(): SnapSettings {
  try {
    const raw = JSON.parse(localStorage.getItem(SNAP_KEY) ?? 'null') as Partial<SnapSettings> | null;
    const mm = Number(raw?.step?.mm);
    const inch = Number(raw?.step?.in);
    return {
      on: raw?.on ?? true,
      step: { mm: mm > 0 ? mm : DEFAULT_SNAP_STEP.mm, in: inch > 0 ? inch : DEFAULT_SNAP_STEP.in },
    };
  } catch {
    return { on: true, step: { ...DEFAULT_SNAP_STEP } };
  }
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
 * mirror and snap settings, the undo history and the saving of it all. The only place edits
 * are applied: components call these actions.
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

  // ---- selection and settings -------------------------------------------------------
  const selectedPoints = ref<string[]>([]);
  const selectedMember = ref<string | null>(null);
  const mirrorLinked = ref(true);
  const snapSettings = ref<SnapSettings>(readSnap());
  const snapOn = computed(() => snapSettings.value.on);
  /** Snap step in the user's unit. */
  const snapStep = computed(() => snapSettings.value.step[prefs.units]);
  const snapStepMm = computed<Mm>(() => unitToMm(snapStep.value, prefs.units));

  function saveSnap() {
    localStorage.setItem(SNAP_KEY, JSON.stringify(snapSettings.value));
  }
  function setSnap(on: boolean) {
    snapSettings.value = { ...snapSettings.value, on };
    saveSnap();
  }
  /** Sets the snap step in the user's unit; refuses a step that is not a positive number. */
  function setSnapStep(step: number): EditResult {
    if (!(Number.isFinite(step) && step > 0)) return { ok: false, error: 'The snap step must be a positive number.' };
    snapSettings.value = { ...snapSettings.value, step: { ...snapSettings.value.step, [prefs.units]: step } };
    saveSnap();
    return { ok: true };
  }
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
    changed();
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
    changed();
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
    changed();
    return true;
  }

  // ---- edits ------------------------------------------------------------------------
  function setPointCoordinate(id: string, axis: edits.Axis, value: Mm): EditResult {
    return commit(`Set ${id}.${axis}`, (d) => edits.setPointCoordinate(d, id, axis, value, mirrorPairs()));
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
  function rename(name: string): EditResult {
    return commit('Rename sketch', (d) => edits.setDocumentField(d, 'name', name));
  }
  /**
   * Sets a top-level field of the document (e.g. the sweep panel's `targets`, the tracing's
   * `tracing`) as one undo step. `live` (a photo being moved, a slider held) merges the run of
   * quick changes to the same field into one step; `coalesce` names such a run explicitly.
   */
  function setDocumentField(
    key: string,
    value: unknown,
    opts: { live?: boolean; coalesce?: string; label?: string } = {},
  ): EditResult {
    const coalesce = opts.coalesce ?? (opts.live ? `field:${key}` : undefined);
    return commit(opts.label ?? `Change ${key}`, (d) => edits.setDocumentField(d, key, value), {
      coalesce,
      windowMs: NUDGE_COALESCE_MS,
    });
  }

  /**
   * Nudges the selected pivots in a view's plane by whole steps: `dh` to the screen's right is
   * negative h (both views draw +h to the left), `dv` up is +z. Repeated nudges undo as one.
   */
  function nudge(view: ViewKind, right: number, up: number, big = false): EditResult {
    const ids = selectedPoints.value;
    if (ids.length === 0) return { ok: false, error: 'Select a pivot to nudge.' };
    const base = snapOn.value ? snapStep.value : FINE_NUDGE_STEP[prefs.units];
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
    const step = snapOn.value ? snapStepMm.value : 0;
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
    drag = null;
    dragging.value = false;
    dragView.value = null;
    const end = document.value;
    if (!end || end === start) return;
    const label = ids.length === 1 ? `Move ${ids[0]}` : `Move ${ids.length} pivots`;
    if (history.record(label, start, end)) {
      historyTick.value++;
      changed();
    }
  }

  /** Abandons the drag (Escape): back to where it started, nothing recorded. */
  function cancelDrag() {
    if (!drag) return;
    document.value = drag.start;
    drag = null;
    dragging.value = false;
    dragView.value = null;
  }

  // ---- saving -----------------------------------------------------------------------
  /** The document as the server last confirmed it. */
  const savedDocument = shallowRef<Sketch | null>(null);
  const saving = ref(false);
  const saveError = ref<string | null>(null);
  /** The server's version when a save was refused as stale (409). */
  const conflictVersion = ref<number | null>(null);
  const lastSavedAt = ref<Date | null>(null);
  let timer: ReturnType<typeof setTimeout> | null = null;
  let pending: Promise<void> | null = null;

  const dirty = computed(() => !!document.value && !deepEqual(savedDocument.value, document.value));
  const saveState = computed<SaveState>(() => {
    if (conflictVersion.value !== null) return 'conflict';
    if (saving.value) return 'saving';
    if (saveError.value && dirty.value) return 'error';
    return dirty.value ? 'unsaved' : 'saved';
  });
  /** True when leaving now would lose something. */
  const hasUnsavedChanges = computed(() => canEdit.value && (dirty.value || saving.value));

  function clearTimer() {
    if (timer) clearTimeout(timer);
    timer = null;
  }

  /** After every change: schedule the autosave (not while a drag is still going). */
  function changed() {
    if (!canEdit.value || drag) return;
    clearTimer();
    timer = setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
  }

  /** Saves the working document now (PUT with the version); resolves when the server has answered. */
  async function save(): Promise<void> {
    clearTimer();
    if (pending) {
      await pending;
      if (dirty.value && conflictVersion.value === null && !saveError.value) return save();
      return;
    }
    const doc = document.value;
    const m = meta.value;
    if (!doc || !m || !canEdit.value || conflictVersion.value !== null || !dirty.value) return;
    if (problems.value.length) {
      saveError.value = `Not saved: ${problems.value.slice(0, 2).join('; ')}`;
      return;
    }
    saving.value = true;
    pending = (async () => {
      try {
        const detail = await api.put<SketchDetail>(`/api/sketches/${m.id}`, {
          document: doc,
          name: doc.name,
          version: m.version,
        });
        meta.value = stripDocument(detail);
        savedDocument.value = doc;
        saveError.value = null;
        lastSavedAt.value = new Date();
      } catch (err) {
        if (err instanceof ApiError && err.status === 409) {
          const v = (err.details as { version?: unknown } | undefined)?.version;
          conflictVersion.value = typeof v === 'number' ? v : (m.version ?? 0) + 1;
        } else saveError.value = errorMessage(err);
      } finally {
        saving.value = false;
        pending = null;
      }
    })();
    await pending;
    // Edits made while the request was out go in the next save.
    if (dirty.value && conflictVersion.value === null && !saveError.value) changed();
  }

  /** Saves at once if anything is waiting (before leaving the page). */
  async function flush(): Promise<void> {
    if (drag) endDrag();
    if (timer || dirty.value) await save();
    else if (pending) await pending;
  }

  /**
   * After a conflict: takes the server's version. The step from the user's document to it is
   * recorded as an undo step, so their edit is one Ctrl+Z away and never lost.
   */
  async function takeServerVersion(): Promise<EditResult> {
    const m = meta.value;
    const mine = document.value;
    if (!m || !mine) return { ok: false, error: 'No sketch is open.' };
    try {
      const detail = await api.get<SketchDetail>(`/api/sketches/${m.id}`);
      meta.value = stripDocument(detail);
      conflictVersion.value = null;
      saveError.value = null;
      if (history.record('Load the saved version', mine, detail.document)) historyTick.value++;
      document.value = detail.document;
      savedDocument.value = detail.document;
      pruneSelection();
      return { ok: true };
    } catch (err) {
      return { ok: false, error: errorMessage(err) };
    }
  }

  /** Saves the working document as a new sketch of the user's (after a conflict); resolves to its id. */
  async function saveAsCopy(): Promise<SketchDetail> {
    const doc = document.value;
    if (!doc) throw new Error('No sketch is open.');
    const name = `${doc.name} (my copy)`.slice(0, 200);
    const created = await api.post<SketchDetail>('/api/sketches', { name, document: { ...doc, name } });
    // The copy holds the edit now: the conflicted sketch has nothing left to save.
    savedDocument.value = doc;
    conflictVersion.value = null;
    return created;
  }

  /** Copies a sketch the user may only read into their library; resolves to the new sketch. */
  async function copyToLibrary(): Promise<SketchDetail> {
    if (sharedToken.value) return api.post<SketchDetail>(`/api/shared/${encodeURIComponent(sharedToken.value)}/copy`);
    if (!meta.value) throw new Error('No sketch is open.');
    return api.post<SketchDetail>(`/api/sketches/${meta.value.id}/copy`);
  }

  // ---- loading ----------------------------------------------------------------------
  function stripDocument(detail: SketchDetail): SketchMeta {
    const { document: _doc, ...rest } = detail;
    return rest;
  }

  /** Puts a sketch from the server on the board, forgetting the previous one. */
  function setLoaded(detail: SketchDetail, token: string | null = null) {
    clearTimer();
    drag = null;
    dragging.value = false;
    dragView.value = null;
    history.clear();
    historyTick.value++;
    meta.value = stripDocument(detail);
    sharedToken.value = token;
    document.value = detail.document;
    savedDocument.value = detail.document;
    viewing.value = null;
    revisions.value = [];
    saveError.value = null;
    conflictVersion.value = null;
    loadError.value = null;
    selectedPoints.value = [];
    selectedMember.value = null;
  }

  async function load(url: string, token: string | null) {
    loading.value = true;
    loadError.value = null;
    try {
      setLoaded(await api.get<SketchDetail>(url), token);
    } catch (err) {
      document.value = null;
      meta.value = null;
      loadError.value =
        err instanceof ApiError && err.status === 404
          ? 'This sketch does not exist, or is not shared with you.'
          : errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  const loadSketch = (id: number) => load(`/api/sketches/${id}`, null);
  const loadShared = (token: string) => load(`/api/shared/${encodeURIComponent(token)}`, token);

  // ---- revisions --------------------------------------------------------------------
  const revisions = ref<Revision[]>([]);
  const revisionsLoading = ref(false);

  async function loadRevisions(): Promise<void> {
    if (!meta.value || sharedToken.value) return;
    revisionsLoading.value = true;
    try {
      const { items } = await api.get<{ items: Revision[] }>(`/api/sketches/${meta.value.id}/revisions`);
      revisions.value = [...items].sort((a, b) => b.rev - a.rev);
    } finally {
      revisionsLoading.value = false;
    }
  }

  async function fetchRevision(rev: number): Promise<RevisionDetail> {
    if (!meta.value) throw new Error('No sketch is open.');
    return api.get<RevisionDetail>(`/api/sketches/${meta.value.id}/revisions/${rev}`);
  }

  /** Shows a revision read-only in place of the working document (which stays as it is). */
  async function openRevision(rev: number): Promise<void> {
    if (drag) endDrag();
    viewing.value = await fetchRevision(rev);
    pruneSelection();
  }

  function closeRevision() {
    viewing.value = null;
    pruneSelection();
  }

  /** Compares two revisions, or a revision with the working document (`to` = 'current'). */
  async function compareRevisions(from: number, to: number | 'current'): Promise<SketchComparison> {
    const a = await fetchRevision(from);
    const b = to === 'current' ? document.value : (await fetchRevision(to)).document;
    if (!b) throw new Error('No sketch is open.');
    return compareSketches(a.document, b);
  }

  /**
   * Restores a revision: the server makes it the newest version. Unsaved edits are saved first;
   * the step back is recorded for undo like any other.
   */
  async function restoreRevision(rev: number): Promise<void> {
    const m = meta.value;
    if (!m || !canEdit.value) throw new Error('This sketch is read-only.');
    await flush();
    if (conflictVersion.value !== null) throw new Error('Resolve the conflict with the saved version first.');
    const detail = await api.post<SketchDetail>(`/api/sketches/${m.id}/restore/${rev}`);
    const mine = document.value;
    meta.value = stripDocument(detail);
    if (mine && history.record(`Restore revision ${rev}`, mine, detail.document)) historyTick.value++;
    document.value = detail.document;
    savedDocument.value = detail.document;
    viewing.value = null;
    pruneSelection();
    await loadRevisions().catch(() => undefined);
  }

  /** Leaves the board: stops the autosave timer (call flush() first to keep edits). */
  function dispose() {
    clearTimer();
    drag = null;
    dragging.value = false;
    dragView.value = null;
  }

  /** Creates a sketch from a starter layout with its default sizes; resolves to the new sketch. */
  async function createFromStarter(layout: Layout, name?: string): Promise<SketchDetail> {
    const spec = starters[layout];
    if (!spec) throw new Error(`There is no starter '${layout}'.`);
    const docName = (name ?? `New ${spec.label.toLowerCase()}`).slice(0, 200);
    const doc = { ...spec.build(), name: docName };
    return api.post<SketchDetail>('/api/sketches', { name: docName, document: doc });
  }

  return {
    // state
    meta,
    sharedToken,
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
    snapOn,
    snapStep,
    snapStepMm,
    dragging,
    dragView,
    canUndo,
    canRedo,
    undoLabel,
    redoLabel,
    saveState,
    saveError,
    conflictVersion,
    lastSavedAt,
    dirty,
    hasUnsavedChanges,
    revisions,
    revisionsLoading,
    // actions
    select,
    setSnap,
    setSnapStep,
    setMirrorLinked,
    commit,
    undo,
    redo,
    setPointCoordinate,
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
    rename,
    setDocumentField,
    nudge,
    beginDrag,
    dragTo,
    endDrag,
    cancelDrag,
    save,
    flush,
    takeServerVersion,
    saveAsCopy,
    copyToLibrary,
    setLoaded,
    loadSketch,
    loadShared,
    loadRevisions,
    openRevision,
    closeRevision,
    compareRevisions,
    restoreRevision,
    dispose,
    createFromStarter,
  };
});
