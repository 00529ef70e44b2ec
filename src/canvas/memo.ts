/**
 * Keeps a drawn item's Konva config object (the very same object) while what it is drawn from is
 * unchanged, so that Vue skips the unchanged nodes of a layer: during a drag only the dragged
 * pivots and their members get new configs, instead of every node being patched each frame.
 * Inputs are compared by identity (documents are immutable, so an unmoved pivot keeps its object).
 */
export function createMemo<T>() {
  let cache = new Map<string, { deps: readonly unknown[]; value: T }>();
  let next = new Map<string, { deps: readonly unknown[]; value: T }>();

  function same(a: readonly unknown[], b: readonly unknown[]): boolean {
    return a.length === b.length && a.every((v, i) => Object.is(v, b[i]));
  }

  return {
    /** The value for `key`: the kept one when `deps` match the last pass's, else a fresh `make()`. */
    get(key: string, deps: readonly unknown[], make: () => T): T {
      const old = cache.get(key);
      const value = old && same(old.deps, deps) ? old.value : make();
      next.set(key, { deps, value });
      return value;
    },
    /** Ends a pass: items not asked for this time are forgotten. */
    done() {
      cache = next;
      next = new Map();
    },
  };
}
