// Records keyed by user ids (layout, switchStates) are plain objects, so an id such as "constructor" or
// "toString" would find a property Object.prototype lends them. Look such records up with these only.

/** The value `record` holds under `key` as its own property; undefined when it has none. */
export function ownValue<T>(record: Readonly<Record<string, T>> | undefined, key: string): T | undefined {
  return record !== undefined && Object.hasOwn(record, key) ? record[key] : undefined;
}

/** A record without a prototype, filled from `entries`: no key is inherited and `__proto__` is an ordinary key. */
export function idRecord<T>(entries: Iterable<readonly [string, T]>): Record<string, T> {
  const out = Object.create(null) as Record<string, T>;
  for (const [k, v] of entries) out[k] = v;
  return out;
}
