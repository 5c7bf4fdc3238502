// The evaluation queue: sheets waiting to be evaluated, one at a time,
// sheets someone is looking at first. A sheet queued again while it waits is
// evaluated once.
export class EvaluationQueue {
  private readonly dirty = new Set<string>();
  private running: Promise<void> | null = null;
  private closed = false;

  constructor(
    private readonly evaluate: (sheet: string) => Promise<void>,
    private readonly isFollowed: (sheet: string) => boolean,
  ) {}

  add(sheet: string): void {
    if (this.closed) return;
    this.dirty.add(sheet);
    this.kick();
  }

  drop(sheet: string): void {
    this.dirty.delete(sheet);
  }

  /** Stops taking work and waits for the evaluation in progress, if any. */
  async close(): Promise<void> {
    this.closed = true;
    this.dirty.clear();
    await this.running;
  }

  private kick(): void {
    if (this.running || this.closed) return;
    this.running = this.drain().finally(() => {
      this.running = null;
      // Work may have arrived between the last loop check and now.
      if (this.dirty.size > 0) this.kick();
    });
  }

  private async drain(): Promise<void> {
    while (this.dirty.size > 0 && !this.closed) {
      let next: string | undefined;
      for (const sheet of this.dirty) {
        if (this.isFollowed(sheet)) {
          next = sheet;
          break;
        }
        next ??= sheet;
      }
      this.dirty.delete(next!);
      await this.evaluate(next!);
    }
  }
}
