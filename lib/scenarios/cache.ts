/**
 * A small in-process LRU for what the what-if panel re-reads on every slider move: the draft's engine
 * input and its stored result, keyed by everything that changes them (scenario revision, dataset, site).
 * A miss only costs a database read; correctness never depends on a hit.
 */
export class Lru<V> {
  private readonly map = new Map<string, V>();
  constructor(private readonly max: number) {}
  get(key: string): V | undefined {
    const v = this.map.get(key);
    if (v !== undefined) {
      this.map.delete(key);
      this.map.set(key, v);
    }
    return v;
  }
  set(key: string, value: V): void {
    this.map.delete(key);
    this.map.set(key, value);
    while (this.map.size > this.max) {
      const oldest = this.map.keys().next().value;
      if (oldest === undefined) break;
      this.map.delete(oldest);
    }
  }
}
