/**
 * Pointer input on one board view: press a pivot and drag it (snapped, mirrored, one undo step);
 * press empty canvas and drag to pan, or click it to clear the selection; Shift-click adds a
 * pivot to the selection; click a member to select it; wheel or pinch to zoom.
 *
 * Pointer positions are stage pixels here and become plane mm only through the view transform.
 * Moves are applied at most once per animation frame, so a fast mouse never queues redraws.
 */
import { onBeforeUnmount, ref, type Ref } from 'vue';
import type Konva from 'konva';
import { useBoardStore } from '../stores/board';
import { screenToPlane, toScreen, type ScreenPoint, type ViewKind } from '../canvas/transform';
import { WHEEL_ZOOM_STEP, type CanvasView } from './useCanvasView';
import { useFrameBatch } from './useFrameBatch';

/** A press that moves less than this (px) is a click. */
const CLICK_SLOP_PX = 4;

type Mode = 'none' | 'drag' | 'pan' | 'pinch' | 'konva';

export function useCanvasPointer(
  view: ViewKind,
  container: Ref<HTMLElement | null>,
  stage: () => Konva.Stage | null,
  canvas: CanvasView,
  onActivate: () => void,
) {
  const board = useBoardStore();
  /** The pivot under the pointer (for the tooltip and the cursor). */
  const hovered = ref<string | null>(null);
  const mode = ref<Mode>('none');

  const pointers = new Map<number, ScreenPoint>();
  let grabOffset = { dx: 0, dy: 0 };
  let last: ScreenPoint = { px: 0, py: 0 };
  let downAt: ScreenPoint = { px: 0, py: 0 };
  let moved = false;
  let pinch = { dist: 0, mid: { px: 0, py: 0 } };
  /** The latest move's work (a drag step or a hover test), done once per animation frame. */
  const moveFrame = useFrameBatch<() => void>((work) => work());

  function local(e: PointerEvent | WheelEvent): ScreenPoint {
    const r = container.value!.getBoundingClientRect();
    return { px: e.clientX - r.left, py: e.clientY - r.top };
  }

  function hit(p: ScreenPoint): Konva.Shape | null {
    return stage()?.getIntersection({ x: p.px, y: p.py }) ?? null;
  }

  function pivotScreen(id: string): ScreenPoint | null {
    const pt = board.sketch?.points.find((q) => q.id === id);
    return pt ? toScreen(view, canvas.transform.value, pt) : null;
  }

  function pinchState(): { dist: number; mid: ScreenPoint } {
    const [a, b] = [...pointers.values()];
    return { dist: Math.hypot(a.px - b.px, a.py - b.py), mid: { px: (a.px + b.px) / 2, py: (a.py + b.py) / 2 } };
  }

  function onPointerDown(e: PointerEvent) {
    if (e.button !== 0 && e.pointerType === 'mouse') return;
    const p = local(e);
    onActivate();
    pointers.set(e.pointerId, p);
    if (pointers.size === 2) {
      if (mode.value === 'drag') board.endDrag();
      mode.value = 'pinch';
      pinch = pinchState();
      return;
    }
    if (pointers.size > 2) return;
    downAt = last = p;
    moved = false;
    const shape = hit(p);
    const pivotId = shape?.getAttr('pivotId') as string | undefined;
    const memberId = shape?.getAttr('memberId') as string | undefined;
    if (pivotId) {
      if (e.shiftKey) {
        board.select(pivotId, { add: true });
        mode.value = 'none';
        return;
      }
      if (!board.beginDrag(view, pivotId)) {
        board.select(pivotId);
        mode.value = 'none';
        return;
      }
      const s = pivotScreen(pivotId)!;
      grabOffset = { dx: p.px - s.px, dy: p.py - s.py };
      mode.value = 'drag';
    } else if (memberId) {
      board.select(memberId);
      mode.value = 'none';
    } else if (shape && shape.getLayer()?.name()?.startsWith('tracing')) {
      // The tracing photo handles its own drag and its scale clicks.
      mode.value = 'konva';
      return;
    } else {
      mode.value = 'pan';
    }
    container.value?.setPointerCapture(e.pointerId);
  }

  function onPointerMove(e: PointerEvent) {
    const p = local(e);
    if (pointers.has(e.pointerId)) pointers.set(e.pointerId, p);
    if (Math.hypot(p.px - downAt.px, p.py - downAt.py) > CLICK_SLOP_PX) moved = true;
    switch (mode.value) {
      case 'drag':
        moveFrame.schedule(() =>
          board.dragTo(screenToPlane(canvas.transform.value, { px: p.px - grabOffset.dx, py: p.py - grabOffset.dy })),
        );
        break;
      case 'pan': {
        const dx = p.px - last.px;
        const dy = p.py - last.py;
        last = p;
        canvas.pan(dx, dy);
        break;
      }
      case 'pinch': {
        if (pointers.size < 2) break;
        const now = pinchState();
        if (pinch.dist > 0) canvas.zoom(now.dist / pinch.dist, now.mid.px, now.mid.py);
        canvas.pan(now.mid.px - pinch.mid.px, now.mid.py - pinch.mid.py);
        pinch = now;
        break;
      }
      case 'none':
        if (e.pointerType === 'mouse')
          moveFrame.schedule(() => (hovered.value = (hit(p)?.getAttr('pivotId') as string | undefined) ?? null));
        break;
    }
  }

  function onPointerUp(e: PointerEvent) {
    pointers.delete(e.pointerId);
    if (container.value?.hasPointerCapture(e.pointerId)) container.value.releasePointerCapture(e.pointerId);
    if (mode.value === 'drag') {
      moveFrame.flush();
      board.endDrag();
    } else if (mode.value === 'pan' && !moved) {
      board.select(null);
    }
    if (mode.value === 'pinch' && pointers.size === 1) {
      last = [...pointers.values()][0];
      mode.value = 'pan';
      moved = true;
      return;
    }
    if (pointers.size === 0) mode.value = 'none';
  }

  function onPointerCancel(e: PointerEvent) {
    pointers.delete(e.pointerId);
    if (mode.value === 'drag') board.cancelDrag();
    if (pointers.size === 0) mode.value = 'none';
  }

  function onPointerLeave() {
    if (mode.value === 'none') hovered.value = null;
  }

  function onWheel(e: WheelEvent) {
    e.preventDefault();
    const p = local(e);
    // Trackpad pinches arrive as wheel events with small deltas: zoom in proportion.
    const notches = Math.max(-4, Math.min(4, -e.deltaY / (e.deltaMode === 1 ? 3 : 100)));
    canvas.zoom(WHEEL_ZOOM_STEP ** notches, p.px, p.py);
  }

  // The move still queued is dropped by useFrameBatch when the view unmounts.
  onBeforeUnmount(() => {
    if (mode.value === 'drag') board.endDrag();
  });

  return {
    hovered,
    mode,
    onPointerDown,
    onPointerMove,
    onPointerUp,
    onPointerCancel,
    onPointerLeave,
    onWheel,
    pivotScreen,
  };
}
