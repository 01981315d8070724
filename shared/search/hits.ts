/**
 * Sparse score accumulator over document positions; a score of 0 means "not matched" (every match
 * adds more than 0). Typed arrays sized to the index, reused through a pool, so a keystroke
 * allocates nothing per matching document.
 */
export class Hits {
  readonly score: Float64Array;
  /** matched positions in the order they were first scored; only the first `count` are live */
  readonly ids: Int32Array;
  count = 0;
  constructor(size: number) {
    this.score = new Float64Array(size);
    this.ids = new Int32Array(size);
  }
  add(p: number, s: number) {
    if (this.score[p] === 0) this.ids[this.count++] = p;
    this.score[p] += s;
  }
  matched(): Int32Array {
    return this.ids.subarray(0, this.count);
  }
  clear() {
    // a broad match is cheaper to wipe in one sweep than entry by entry
    if (this.count * 8 > this.score.length) this.score.fill(0);
    else for (let i = 0; i < this.count; i++) this.score[this.ids[i]] = 0;
    this.count = 0;
  }
}

/** Hands out cleared accumulators of one size; a new size (documents were added) starts a new pool. */
export class HitsPool {
  private free: Hits[] = [];
  private size = 0;
  take(size: number): Hits {
    if (size !== this.size) {
      this.free = [];
      this.size = size;
    }
    return this.free.pop() ?? new Hits(size);
  }
  give(h: Hits) {
    if (h.score.length !== this.size) return;
    h.clear();
    this.free.push(h);
  }
}
