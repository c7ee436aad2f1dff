// Memo tables kept beside a library's data, so what is derived from the data (series found by
// solute, interpolants, dissolution products, infinite-dilution anchors) is worked out once per
// library instead of on every call. A library is read-only once built (createChemistryLibrary
// returns a new one); the tables live as long as the data object they hang on (WeakMap).

const tables = new WeakMap<object, Map<string, Map<string, unknown>>>();

/**
 * The value of `compute()` for (`owner`, `table`, `key`), computed on the first call and
 * remembered while `owner` lives. A `compute` that throws remembers nothing (the next call
 * throws again, with the same message).
 *
 * @example memo(lib.dilution, 'series', 'NH4NO3(cr)', () => lookUp('NH4NO3(cr)'))
 */
export function memo<T>(owner: object, table: string, key: string, compute: () => T): T {
  let byTable = tables.get(owner);
  if (!byTable) {
    byTable = new Map();
    tables.set(owner, byTable);
  }
  let entries = byTable.get(table);
  if (!entries) {
    entries = new Map();
    byTable.set(table, entries);
  }
  if (entries.has(key)) return entries.get(key) as T;
  const value = compute();
  entries.set(key, value);
  return value;
}
