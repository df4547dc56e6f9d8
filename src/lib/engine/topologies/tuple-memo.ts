// Answers kept by a short tuple of numbers and strings, in nested maps: a look-up builds no text
// key (turning a dozen doubles into text cost more than the maps). Map keys compare as
// SameValueZero, which tells numbers apart exactly where their text would (0 and −0 aside, which
// text does not tell apart either).

type Part = number | string | undefined;

export class TupleMemo<V> {
  private root = new Map<Part, unknown>();
  private size = 0;

  /** `limit`: the memo is emptied once it holds this many answers. */
  constructor(private readonly limit = Number.POSITIVE_INFINITY) {}

  /** The answer kept for `key`, or `make()`'s, kept. */
  get(key: readonly Part[], make: () => V): V {
    let node = this.root;
    const last = key.length - 1;
    for (let i = 0; i < last; i += 1) {
      let next = node.get(key[i]) as Map<Part, unknown> | undefined;
      if (!next) {
        next = new Map();
        node.set(key[i], next);
      }
      node = next;
    }
    if (node.has(key[last])) return node.get(key[last]) as V;
    const value = make();
    if (this.size >= this.limit) {
      this.root = new Map();
      this.size = 0;
      return this.get(key, () => value);
    }
    node.set(key[last], value);
    this.size += 1;
    return value;
  }
}
