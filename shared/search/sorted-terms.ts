/**
 * Terms in code-unit order with their ids, for prefix lookups: a prefix is a contiguous run found by
 * binary search. Terms added since the last lookup are sorted and merged in on the next one.
 */
export class SortedTerms {
  private terms: string[] = [];
  private ids: number[] = [];
  private pending: [string, number][] = [];

  add(term: string, id: number) {
    this.pending.push([term, id]);
  }

  private flush() {
    if (this.pending.length === 0) return;
    const added = this.pending.sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
    this.pending = [];
    const terms: string[] = [];
    const ids: number[] = [];
    let i = 0;
    let j = 0;
    while (i < this.terms.length || j < added.length) {
      if (j === added.length || (i < this.terms.length && this.terms[i] < added[j][0])) {
        terms.push(this.terms[i]);
        ids.push(this.ids[i++]);
      } else {
        terms.push(added[j][0]);
        ids.push(added[j++][1]);
      }
    }
    this.terms = terms;
    this.ids = ids;
  }

  /** ids of every term starting with `prefix`, the prefix itself included */
  withPrefix(prefix: string, into: number[] = []): number[] {
    this.flush();
    const { terms } = this;
    let lo = 0;
    let hi = terms.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (terms[mid] < prefix) lo = mid + 1;
      else hi = mid;
    }
    for (let t = lo; t < terms.length && terms[t].startsWith(prefix); t++) into.push(this.ids[t]);
    return into;
  }
}
