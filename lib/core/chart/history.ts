// Undo and redo as a value: every edit returns a new chart, so history is a list of past values.
import type { Chart } from "./model";

export interface ChartHistory {
  readonly past: readonly Chart[];
  readonly present: Chart;
  readonly future: readonly Chart[];
  /** most undo steps kept; the oldest are dropped first */
  readonly limit: number;
}

export function createHistory(present: Chart, limit = 100): ChartHistory {
  if (!Number.isInteger(limit) || limit < 1) throw new RangeError(`history limit must be a whole number of at least 1 (got ${limit})`);
  return { past: [], present, future: [], limit };
}

/** Records an edit: the new chart becomes present and anything that could be redone is dropped. */
export function commitChart(history: ChartHistory, chart: Chart): ChartHistory {
  if (chart === history.present) return history;
  const past = [...history.past, history.present];
  return { ...history, past: past.length > history.limit ? past.slice(past.length - history.limit) : past, present: chart, future: [] };
}

export function canUndo(history: ChartHistory): boolean {
  return history.past.length > 0;
}

export function canRedo(history: ChartHistory): boolean {
  return history.future.length > 0;
}

export function undo(history: ChartHistory): ChartHistory {
  if (!canUndo(history)) return history;
  const previous = history.past[history.past.length - 1];
  return { ...history, past: history.past.slice(0, -1), present: previous, future: [history.present, ...history.future] };
}

export function redo(history: ChartHistory): ChartHistory {
  if (!canRedo(history)) return history;
  const [next, ...rest] = history.future;
  return { ...history, past: [...history.past, history.present], present: next, future: rest };
}
