// The evaluation queue: sheets waiting to be evaluated, sheets someone is
// looking at first. A sheet queued again while it waits is evaluated once, and
// never twice at the same time. With more than one lane (the sandbox pool has
// two evaluators) a lane takes the next sheet as soon as it is free, so one
// slow sheet holds back only its own lane: each sheet goes back to the lane it
// last ran on (its caches are there) unless that lane is busy and another is free.
export class EvaluationQueue {
  private readonly dirty = new Set<string>();
  /** Sheet → lane, for the evaluations in progress. */
  private readonly running = new Map<string, number>();
  private readonly busyLanes: boolean[];
  /** The lane each sheet last ran on. */
  private readonly home = new Map<string, number>();
  private readonly inFlight = new Set<Promise<void>>();
  private closed = false;

  constructor(
    private readonly evaluate: (sheet: string, lane: number) => Promise<void>,
    private readonly isFollowed: (sheet: string) => boolean,
    lanes = 1,
  ) {
    this.busyLanes = Array.from({ length: Math.max(1, lanes) }, () => false);
  }

  add(sheet: string): void {
    if (this.closed) return;
    this.dirty.add(sheet);
    this.kick();
  }

  drop(sheet: string): void {
    this.dirty.delete(sheet);
    this.home.delete(sheet);
  }

  /** Stops taking work and waits for the evaluations in progress, if any. */
  async close(): Promise<void> {
    this.closed = true;
    this.dirty.clear();
    await Promise.all([...this.inFlight]);
  }

  private kick(): void {
    if (this.closed) return;
    for (;;) {
      const free = this.busyLanes.flatMap((busy, lane) => (busy ? [] : [lane]));
      if (free.length === 0) return;
      const next = this.pick(free);
      if (!next) return;
      this.start(next.sheet, next.lane);
    }
  }

  /** The most urgent waiting sheet a free lane can take: followed ones first, each at home if its home is free. */
  private pick(free: number[]): { sheet: string; lane: number } | undefined {
    let best: { sheet: string; lane: number; rank: number } | undefined;
    for (const sheet of this.dirty) {
      if (this.running.has(sheet)) continue;
      const home = this.home.get(sheet);
      const atHome = home !== undefined && free.includes(home);
      const rank = (this.isFollowed(sheet) ? 2 : 0) + (atHome ? 1 : 0);
      if (!best || rank > best.rank) best = { sheet, lane: atHome ? home! : free[0]!, rank };
      if (rank === 3) break;
    }
    return best;
  }

  private start(sheet: string, lane: number): void {
    this.dirty.delete(sheet);
    this.running.set(sheet, lane);
    this.busyLanes[lane] = true;
    this.home.set(sheet, lane);
    const job = this.evaluate(sheet, lane)
      .catch(() => {})
      .finally(() => {
        this.running.delete(sheet);
        this.busyLanes[lane] = false;
        this.inFlight.delete(job);
        // Work may have arrived while this one ran.
        this.kick();
      });
    this.inFlight.add(job);
  }
}
