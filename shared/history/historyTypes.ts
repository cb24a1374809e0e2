// What the history routes answer (docs/stack-history.md).
import type { StackDocument } from '../schema/stack.ts';

export interface HistoryEntry {
  version: number;
  by: { userId: number; name: string } | null;
  at: string;
  /** The kind of write, as the audit log names it (stack.create, stack.edit, level.update…). */
  action: string;
  /** What changed, in words. */
  changes: string[];
}

export interface StackHistory {
  entries: HistoryEntry[];
  /** False when earlier versions cannot be rebuilt: the stack's starting document was not kept (older stacks). */
  complete: boolean;
}

/** One part of the stack as it was, bottom first: what it is, where, and its figures in words. */
export interface OutlineRow {
  part: string;
  where: string;
  details: string;
}

export interface StackAsOf {
  version: number;
  doc: StackDocument;
  outline: OutlineRow[];
}
