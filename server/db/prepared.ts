import type { Db } from "./client";

const MAX_SHAPES = 200;

/**
 * A hot query built and prepared once per database, instead of on every request: building the SQL in Drizzle and
 * compiling it in SQLite otherwise cost more than running a small query. Inputs go in as `sql.placeholder("name")`.
 * A query that takes several forms (say, which filters are on) gets its form as `shape`; `keyOf` names each form,
 * and each is built on first use. A transaction handle works too (its queries are kept while it lives).
 */
export function preparedQuery<Q, S = void, D extends object = Db>(build: (db: D, shape: S) => Q, keyOf: (shape: S) => string = String) {
  const byDb = new WeakMap<D, Map<string, Q>>();
  return (db: D, shape: S): Q => {
    let forms = byDb.get(db);
    if (!forms) byDb.set(db, (forms = new Map()));
    const key = keyOf(shape);
    let query = forms.get(key);
    if (!query) {
      if (forms.size >= MAX_SHAPES) forms.delete(forms.keys().next().value!);
      forms.set(key, (query = build(db, shape)));
    }
    return query;
  };
}
