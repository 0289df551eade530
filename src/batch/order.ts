/**
 * Batch rows in job order although workers finish jobs in any order: each job's rows are held until every
 * earlier job's rows have been handed on, then passed on whole (one call per job, so a writer can keep one
 * write per job and never tear a row). On interruption `flush` hands on everything finished, still in
 * ascending job order, skipping the jobs that never finished.
 */
export class InJobOrder<T> {
  private next = 0;
  private readonly held = new Map<number, T>();

  /** `emit` receives each job's item with its index (0-based job position), in ascending order. */
  constructor(private readonly emit: (item: T, index: number) => void) {}

  /** A finished job (0-based position in the job list); emits it and any held jobs that now follow on. */
  put(index: number, item: T): void {
    if (index < this.next || this.held.has(index)) throw new Error(`job ${index} was delivered twice`);
    this.held.set(index, item);
    while (this.held.has(this.next)) {
      const k = this.next;
      const it = this.held.get(k)!;
      this.held.delete(k);
      this.next++;
      this.emit(it, k);
    }
  }

  /** Jobs finished but waiting for an earlier one. */
  get waiting(): number {
    return this.held.size;
  }

  /** Hand on every held job in ascending order (an interrupted run: the gaps are jobs that never finished). */
  flush(): void {
    const keys = [...this.held.keys()].sort((a, b) => a - b);
    for (const k of keys) {
      const it = this.held.get(k)!;
      this.held.delete(k);
      this.next = k + 1;
      this.emit(it, k);
    }
  }
}
