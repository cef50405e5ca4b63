// Undo and redo as the history of documents: each step keeps the whole previous document, which is
// cheap because perform shares every unchanged part.

import { coalesceKey, perform, type Action, type ActionType } from './actions';
import type { EditorDocument } from './editorDocument';

export interface HistoryStep {
  document: EditorDocument;
  /** The action that led from this document to the next one (for "Undo <what>"). */
  action: ActionType;
}

export interface History {
  past: HistoryStep[];
  present: EditorDocument;
  /** Most recently undone first. */
  future: HistoryStep[];
  /** Key of the last action, for merging keystrokes in one cell into one step. */
  lastKey: string | null;
  /** Bumped on every change of `present`; lets async work tell whether its input is still current. */
  revision: number;
}

export type HistoryCommand =
  | { type: 'perform'; action: Action }
  | { type: 'undo' }
  | { type: 'redo' }
  /** Ends the current merge, so the next keystroke starts a new undo step (e.g. when a cell loses focus). */
  | { type: 'seal' }
  /** A fresh history, e.g. after opening a file when the old one should not be undoable into. */
  | { type: 'reset'; document: EditorDocument };

export const MAX_UNDO_STEPS = 200;

export function createHistory(document: EditorDocument): History {
  return { past: [], present: document, future: [], lastKey: null, revision: 0 };
}

export function historyReducer(history: History, command: HistoryCommand): History {
  switch (command.type) {
    case 'perform': {
      const next = perform(history.present, command.action);
      if (next === history.present) return history;
      const key = coalesceKey(command.action);
      if (key !== null && key === history.lastKey && history.past.length > 0) {
        return { ...history, present: next, future: [], revision: history.revision + 1 };
      }
      const past = [...history.past, { document: history.present, action: command.action.type }].slice(-MAX_UNDO_STEPS);
      return { past, present: next, future: [], lastKey: key, revision: history.revision + 1 };
    }
    case 'undo': {
      const step = history.past[history.past.length - 1];
      if (!step) return history;
      return {
        past: history.past.slice(0, -1),
        present: step.document,
        future: [{ document: history.present, action: step.action }, ...history.future],
        lastKey: null,
        revision: history.revision + 1,
      };
    }
    case 'redo': {
      const [step, ...rest] = history.future;
      if (!step) return history;
      return {
        past: [...history.past, { document: history.present, action: step.action }],
        present: step.document,
        future: rest,
        lastKey: null,
        revision: history.revision + 1,
      };
    }
    case 'seal':
      return history.lastKey === null ? history : { ...history, lastKey: null };
    case 'reset':
      return { past: [], present: command.document, future: [], lastKey: null, revision: history.revision + 1 };
  }
}

export function canUndo(history: History): boolean {
  return history.past.length > 0;
}

export function canRedo(history: History): boolean {
  return history.future.length > 0;
}
