import type { EstimateContent } from '@gloaming/contracts';
import { useCallback, useMemo, useReducer } from 'react';
import { flattenEstimate, type GridRow } from '../grid/estimate-rows';
import { COLUMN_COUNT } from '../grid/grid-columns';
import type { CellProblem } from '../grid/line-edits';
import { cellSelection, clampSelection, type Selection } from '../grid/selection';
import { createUndoStack, pushState, redo, undo, type UndoStack } from '../grid/undo-stack';

/** One undo step: the document and where the selection was. */
interface Snapshot {
  content: EstimateContent;
  selection: Selection;
}

interface EditorState {
  history: UndoStack<Snapshot>;
  selection: Selection;
  problems: CellProblem[];
}

type Action =
  | { type: 'select'; selection: Selection }
  | { type: 'change'; content: EstimateContent; selection?: Selection; problems?: CellProblem[] }
  | { type: 'undo' }
  | { type: 'redo' }
  | { type: 'replace'; content: EstimateContent };

function reducer(state: EditorState, action: Action): EditorState {
  switch (action.type) {
    case 'select':
      return { ...state, selection: action.selection };
    case 'change': {
      const selection = action.selection ?? state.selection;
      if (action.content === state.history.present.content) return { ...state, selection, problems: action.problems ?? [] };
      // The step remembers the selection before the change, so undo puts the cursor back.
      const before = { ...state.history.present, selection: state.selection };
      const history = pushState({ ...state.history, present: before }, { content: action.content, selection });
      return { history, selection, problems: action.problems ?? [] };
    }
    case 'undo': {
      const history = undo({ ...state.history, present: { ...state.history.present, selection: state.selection } });
      return { history, selection: history.present.selection, problems: [] };
    }
    case 'redo': {
      const history = redo(state.history);
      return { history, selection: history.present.selection, problems: [] };
    }
    case 'replace': {
      // "Reload theirs": a step of its own, so Ctrl+Z still reaches what was typed before.
      const history = pushState(state.history, { content: action.content, selection: state.selection });
      return { ...state, history, problems: [] };
    }
  }
}

/** The grid's editing state: the document with many-step undo/redo, the selection, cell problems. */
export function useEstimateEditor(initial: EstimateContent) {
  const [state, dispatch] = useReducer(reducer, initial, (content) => ({
    history: createUndoStack<Snapshot>({ content, selection: cellSelection({ row: 1, col: 1 }) }),
    selection: cellSelection({ row: content.sections[0]?.lines.length ? 1 : 0, col: 1 }),
    problems: [],
  }));
  const content = state.history.present.content;
  const rows: GridRow[] = useMemo(() => flattenEstimate(content), [content]);
  const selection = useMemo(() => clampSelection(state.selection, rows.length, COLUMN_COUNT), [state.selection, rows.length]);
  return {
    content,
    rows,
    selection,
    problems: state.problems,
    canUndo: state.history.past.length > 0,
    canRedo: state.history.future.length > 0,
    select: useCallback((s: Selection) => dispatch({ type: 'select', selection: s }), []),
    change: useCallback((c: EstimateContent, s?: Selection, problems?: CellProblem[]) => dispatch({ type: 'change', content: c, ...(s ? { selection: s } : {}), ...(problems ? { problems } : {}) }), []),
    undo: useCallback(() => dispatch({ type: 'undo' }), []),
    redo: useCallback(() => dispatch({ type: 'redo' }), []),
    replace: useCallback((c: EstimateContent) => dispatch({ type: 'replace', content: c }), []),
  };
}

export type EstimateEditor = ReturnType<typeof useEstimateEditor>;
