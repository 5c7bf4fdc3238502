// Bounds on one sheet's evaluation. The interpreter enforces them itself;
// the sandbox's heap cap and wall clock are the outer guard.
import { SheetError } from '../diagnostics.js';
import type { Span } from '../parse/ast.js';

export interface Limits {
  /** Interpreter steps (nodes visited plus list elements touched) per sheet. */
  maxSteps: number;
  /** Longest list a sheet may build. */
  maxListLength: number;
  /** Wall-clock budget in milliseconds, checked as steps go by. */
  timeoutMs: number;
  /**
   * List items the sheet's values may hold at once, all lists together. Set so
   * that this limit, not the sandbox's heap, is what a sheet of large lists meets.
   */
  maxHeldItems?: number;
}

export const DEFAULT_LIMITS: Limits = { maxSteps: 5_000_000, maxListLength: 100_000, timeoutMs: 2000, maxHeldItems: 1_000_000 };

/** The sheet ran out of its own budget (steps, time, values held): the rest of the sheet is not evaluated. */
export class BudgetError extends SheetError {}

export class Budget {
  private steps = 0;
  private held = 0;
  private readonly deadline: number;
  constructor(readonly limits: Limits) {
    this.deadline = Date.now() + limits.timeoutMs;
  }

  spend(n: number, span?: Span): void {
    this.steps += n;
    if (this.steps > this.limits.maxSteps) {
      throw new BudgetError('limit', `the sheet went past ${this.limits.maxSteps.toLocaleString('en')} evaluation steps`, span);
    }
    if ((this.steps & 0x3ff) < n && Date.now() > this.deadline) {
      throw new BudgetError('limit', `evaluation stopped after ${this.limits.timeoutMs} ms`, span);
    }
  }

  /** The sheet now holds `n` more list items (a statement's value). */
  hold(n: number, span?: Span): void {
    this.held += n;
    const max = this.limits.maxHeldItems ?? DEFAULT_LIMITS.maxHeldItems!;
    if (this.held > max) {
      throw new BudgetError('limit', `the sheet's lists hold more than ${max.toLocaleString('en')} values in all; reduce the points of a sweep or read the data from a file in fewer steps`, span);
    }
  }

  checkLength(n: number, span?: Span): void {
    if (n > this.limits.maxListLength) {
      throw new SheetError('limit', `a list of ${n} items is longer than the limit of ${this.limits.maxListLength}`, span);
    }
  }
}
