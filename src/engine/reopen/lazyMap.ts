// A cache map whose entries are made when first asked for: the engine's caches (EngineCache.systems, .unitColumns)
// are read with get(), so an opened or split network can hand out systems derived from the base factorization on
// demand, and solveFault never factorizes it.
export class LazyMap<V> extends Map<string, V> {
  constructor(
    private readonly make: (key: string) => V,
    /** Keys this map makes; others read as absent. */
    private readonly pattern: RegExp,
  ) {
    super();
  }
  override get(key: string): V | undefined {
    let v = super.get(key);
    if (v === undefined && this.pattern.test(key)) {
      v = this.make(key);
      super.set(key, v);
    }
    return v;
  }
}
