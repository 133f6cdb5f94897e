/**
 * Undo and redo over immutable snapshots. Each step stores the whole state, which is cheap
 * because edits share every unchanged section and line with the previous snapshot.
 */
export interface UndoStack<T> {
  readonly past: readonly T[];
  readonly present: T;
  readonly future: readonly T[];
}

export const UNDO_LIMIT = 500;

export function createUndoStack<T>(present: T): UndoStack<T> {
  return { past: [], present, future: [] };
}

/** A new present; the redo list is dropped; the oldest steps fall off past `limit`. */
export function pushState<T>(stack: UndoStack<T>, next: T, limit = UNDO_LIMIT): UndoStack<T> {
  if (Object.is(next, stack.present)) return stack;
  const past = stack.past.length >= limit ? [...stack.past.slice(stack.past.length - limit + 1), stack.present] : [...stack.past, stack.present];
  return { past, present: next, future: [] };
}

export function undo<T>(stack: UndoStack<T>): UndoStack<T> {
  if (stack.past.length === 0) return stack;
  return { past: stack.past.slice(0, -1), present: stack.past[stack.past.length - 1]!, future: [stack.present, ...stack.future] };
}

export function redo<T>(stack: UndoStack<T>): UndoStack<T> {
  if (stack.future.length === 0) return stack;
  return { past: [...stack.past, stack.present], present: stack.future[0]!, future: stack.future.slice(1) };
}

/** Replace the present without a step (e.g. the server's copy after "reload theirs"). */
export function resetTo<T>(present: T): UndoStack<T> {
  return createUndoStack(present);
}
