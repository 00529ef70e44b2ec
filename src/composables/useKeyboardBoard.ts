/**
 * The board's keys: Ctrl+Z undo, Ctrl+Shift+Z or Ctrl+Y redo (⌘ on a Mac), arrows nudge the
 * selected pivots in the active view (Shift: ten times), Delete removes the selected member,
 * Escape cancels a drag or clears the selection, F fits the active view.
 * Keys typed into a field belong to the field (its own undo included), and keys pressed in a dialog or a menu
 * over the board belong to it (an arrow there moves through its items, not the selected pivot).
 */
import type { Ref } from 'vue';
import { useEventListener } from '@vueuse/core';
import type { ViewKind } from '../canvas/transform';
import { useBoardStore } from '../stores/board';

export interface BoardKeyHandlers {
  fit: (view: ViewKind) => void;
  /** Shown when a key's edit is refused (e.g. read-only). */
  refuse?: (message: string) => void;
}

function typingInto(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

/** Quasar's dialogs carry role="dialog"; its menus the class q-menu (their role is their list's). */
function inPopup(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return typeof el?.closest === 'function' && el.closest('[role="dialog"], .q-menu') !== null;
}

const ARROWS: Record<string, [number, number]> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  ArrowUp: [0, 1],
  ArrowDown: [0, -1],
};

export function useKeyboardBoard(activeView: Ref<ViewKind>, handlers: BoardKeyHandlers) {
  const board = useBoardStore();

  function onKey(e: KeyboardEvent) {
    if (typingInto(e.target) || inPopup(e.target) || e.altKey) return;
    const mod = e.ctrlKey || e.metaKey;
    const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
    if (mod && key === 'z') {
      e.preventDefault();
      if (e.shiftKey) board.redo();
      else board.undo();
      return;
    }
    if (mod && key === 'y') {
      e.preventDefault();
      board.redo();
      return;
    }
    if (mod) return;
    const arrow = ARROWS[e.key];
    if (arrow && board.selectedPoints.length) {
      e.preventDefault();
      const r = board.nudge(activeView.value, arrow[0], arrow[1], e.shiftKey);
      if (!r.ok) handlers.refuse?.(r.error);
      return;
    }
    if ((e.key === 'Delete' || e.key === 'Backspace') && board.selectedMember) {
      e.preventDefault();
      const r = board.deleteMember(board.selectedMember);
      if (!r.ok) handlers.refuse?.(r.error);
      return;
    }
    if (e.key === 'Escape') {
      if (board.dragging) board.cancelDrag();
      else board.select(null);
      return;
    }
    if (key === 'f') handlers.fit(activeView.value);
  }

  useEventListener(window, 'keydown', onKey);
}
