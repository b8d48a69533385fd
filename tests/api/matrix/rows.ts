import type { Shop } from "../../support/test-app";

/** Who calls a route in the role matrix. */
export type Who = "anonymous" | "owner" | "estimator" | "painter" | "customer";
/** One row: how to call the route on a fresh demo-like shop, and the status each caller must get. */
export type MatrixCase = {
  path: (s: Shop) => string;
  body?: (s: Shop) => object;
  /** Extra setup on the fresh shop before the call (e.g. create the record the route needs). */
  prepare?: (s: Shop) => unknown | Promise<unknown>;
  expect: Record<Who, number>;
  /** A file to send as multipart/form-data (field "file"), with text fields beside it (instead of a JSON body). */
  attach?: (s: Shop) => { data: Buffer; filename: string; fields?: Record<string, string> };
};
export type MatrixRows = Record<string, MatrixCase>;

export const all = (status: number): Record<Who, number> => ({ anonymous: status, owner: status, estimator: status, painter: status, customer: status });
export const signedIn = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: status, customer: status });
export const staff = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: status, customer: 403 });
export const office = (status: number) => ({ anonymous: 401, owner: status, estimator: status, painter: 403, customer: 403 });
export const ownerOnly = (status: number) => ({ anonymous: 401, owner: status, estimator: 403, painter: 403, customer: 403 });
export const customerOnly = (status: number) => ({ anonymous: 401, owner: 403, estimator: 403, painter: 403, customer: status });

/** Calls a row's route on its shop as `who` (JSON body or multipart file, as the row says). */
export function callRow(shop: Shop, key: string, c: MatrixCase, who: Who) {
  const [method] = key.split(" ") as [string];
  const m = method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
  let req = shop.as(who)[m](c.path(shop));
  if (c.body) req = req.send(c.body(shop));
  if (c.attach) {
    const file = c.attach(shop);
    for (const [k, v] of Object.entries(file.fields ?? {})) req = req.field(k, v);
    req = req.attach("file", file.data, file.filename);
  }
  return req;
}
