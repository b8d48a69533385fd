import { describe, expect, it } from "vitest";
import fc from "fast-check";
import type { z } from "zod";
import { makeApp, makeShop, type Shop } from "../support/test-app";
import { PATCH_SPECS, type PatchSpec } from "../support/patch-specs";
import type { MatrixRows } from "./matrix/rows";

/**
 * A PATCH changes the fields it sends and nothing else. For every PATCH route: the record is first given a value
 * in every field (one PATCH per field), then fast-check sends runs of random single-field changes; after each, every
 * other field of the record as read back must be as it was, and the field sent must read back as sent.
 * (A `.partial()` schema over fields with `.default()` once reset the shop's address, terms and VOC limits
 * whenever the deposit was changed.)
 */
const files = import.meta.glob<{ rows?: MatrixRows }>("./matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));

/** Timestamps and the edit counter move on every save. */
const ALWAYS_MOVES = new Set(["updatedAt", "version", "editVersion"]);

type Change = { name: string; body: Record<string, unknown> };

/** { a: { b: 1 }, c: [..] } → { "a.b": "1", "c": "[..]" } (arrays compared whole). */
function flatten(value: unknown, prefix = "", out: Record<string, string> = {}) {
  if (value && typeof value === "object" && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else out[prefix] = JSON.stringify(value);
  return out;
}

async function readRecord(s: Shop, spec: PatchSpec): Promise<Record<string, unknown>> {
  const res = await s.as("owner").get(spec.read(s));
  expect(res.status, `read back ${spec.read(s)}`).toBe(200);
  const record = (spec.pick ? spec.pick(res.body, s) : res.body) as Record<string, unknown> | undefined;
  expect(record, "the record is in the read-back answer").toBeTruthy();
  return record!;
}

async function applyAndCheck(s: Shop, key: string, spec: PatchSpec, change: Change) {
  const before = await readRecord(s, spec);
  const body = { ...change.body };
  const versionKey = spec.versionKey ?? "version";
  if (versionKey in spec.schema.shape && typeof before[versionKey] === "number") body[versionKey] = before[versionKey];
  const path = (spec.path ?? MATRIX[key]!.path)(s);
  const res = await s.as("owner").patch(path).send(body);
  expect(res.status, `${key} ${JSON.stringify(body)} → ${JSON.stringify(res.body)}`).toBe(200);
  const after = await readRecord(s, spec);

  const sent = Object.keys(change.body);
  const allowed = new Set([...ALWAYS_MOVES, ...(spec.stamps ?? []), ...sent, ...sent.flatMap((k) => spec.follows?.[k] ?? [])]);
  const b = flatten(before);
  const a = flatten(after);
  const moved = [...new Set([...Object.keys(b), ...Object.keys(a)])]
    .filter((p) => b[p] !== a[p])
    .filter((p) => !allowed.has(p.split(".").pop()!) && !p.split(".").some((_, i, parts) => allowed.has(parts.slice(0, i + 1).join("."))))
    .map((p) => `${p}: ${b[p]} → ${a[p]}`);
  expect(moved, `${key} sent ${JSON.stringify(change.body)}; other fields moved`).toEqual([]);
  for (const [k, sentValue] of Object.entries(change.body)) {
    if (!(k in after)) continue;
    const v = spec.readAs?.[k] ? spec.readAs[k](sentValue) : sentValue;
    if (Array.isArray(v) && v.some((x) => typeof x === "object")) expect(after[k], `${k} reads back as sent`).toMatchObject(v);
    else expect(after[k], `${k} reads back as sent`).toEqual(v);
  }
}

describe("a PATCH changes only the fields it sends", () => {
  it("every PATCH route has a spec", () => {
    const { app } = makeApp();
    const routes = app.routes.filter((r: { method: string }) => r.method === "PATCH").map((r: { path: string }) => `PATCH ${r.path}`);
    expect(Object.keys(PATCH_SPECS).sort()).toEqual(routes.sort());
  });

  it("no PATCH schema fills in a field that was left out", () => {
    const filled = Object.entries(PATCH_SPECS).flatMap(([key, spec]) =>
      Object.entries(spec.schema.shape)
        .filter(([, field]) => (field as z.ZodType).safeParse(undefined).data !== undefined)
        .map(([field]) => `${key}: ${field}`),
    );
    expect(filled).toEqual([]);
  });

  for (const [key, spec] of Object.entries(PATCH_SPECS)) {
    it(key, async () => {
      const s = await makeShop();
      await MATRIX[key]?.prepare?.(s);
      await spec.prepare?.(s);
      const changes = Object.entries(spec.changes).map(([name, make]) => make(s).map((body): Change => ({ name, body })));

      // Every field the route takes is changed by some generator.
      const covered = new Set(changes.flatMap((c) => fc.sample(c, 30).flatMap((x) => Object.keys(x.body))));
      expect([...covered].sort()).toEqual(Object.keys(spec.schema.shape).filter((k) => k !== (spec.versionKey ?? "version")).sort());

      // A value in every field first, so a field reset to its default shows.
      for (const c of changes) await applyAndCheck(s, key, spec, fc.sample(c, { numRuns: 1, seed: 7 })[0]!);

      await fc.assert(
        fc.asyncProperty(fc.array(fc.oneof(...changes), { minLength: 1, maxLength: 5 }), async (steps) => {
          for (const step of steps) await applyAndCheck(s, key, spec, step);
        }),
        { numRuns: 12 },
      );
    }, 60_000);
  }
});
