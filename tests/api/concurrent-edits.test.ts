import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { makeShop, type Shop } from "../support/test-app";
import { PATCH_SPECS, type PatchSpec } from "../support/patch-specs";
import { fx } from "../support/finish-fixtures";
import type { MatrixRows } from "./matrix/rows";

/**
 * Two people saving one record. Both read it at the same version; both save at the same moment. Exactly one save
 * lands; the other gets 409 `version_conflict` with the record as it is now and who saved it, and changes nothing.
 * Saving again from the newer version then lands. (Before versions, owner and estimator both got 200 on
 * PUT /api/plans/1 and the first one's change was silently lost.)
 */
const files = import.meta.glob<{ rows?: MatrixRows }>("./matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));

/** The names makeShop gives its users (tests/support/test-app.ts). */
const NAMES = { owner: "Test owner", estimator: "Test estimator" } as const;

async function read(s: Shop, spec: PatchSpec) {
  const res = await s.as("owner").get(spec.read(s));
  expect(res.status).toBe(200);
  const record = (spec.pick ? spec.pick(res.body, s) : res.body) as Record<string, unknown>;
  return { ...record, version: record[spec.versionKey ?? "version"] as number };
}

/** Two different single-field changes the route accepts. */
function twoChanges(s: Shop, spec: PatchSpec): [Record<string, unknown>, Record<string, unknown>] {
  for (const make of Object.values(spec.changes)) {
    const samples = fc.sample(make(s), { numRuns: 40, seed: 11 });
    const a = samples[0]!;
    const b = samples.find((x) => JSON.stringify(x) !== JSON.stringify(a));
    if (b) return [a, b];
  }
  throw new Error("no two different changes");
}

describe("two people saving one record", () => {
  for (const [key, spec] of Object.entries(PATCH_SPECS)) {
    it(`${key}: one of two saves at the same moment lands, the other is told who saved first`, async () => {
      const s = await makeShop();
      await MATRIX[key]?.prepare?.(s);
      await spec.prepare?.(s);
      const path = (spec.path ?? MATRIX[key]!.path)(s);
      const key_ = spec.versionKey ?? "version";
      // The second person: the estimator where the office may edit, else a second tab of the owner.
      const other = MATRIX[key]!.expect.estimator < 300 ? "estimator" : "owner";
      const before = await read(s, spec);
      expect(typeof before.version).toBe("number");
      const [a, b] = twoChanges(s, spec);
      const [first, second] = await Promise.all([
        s.as("owner").patch(path).send({ ...a, [key_]: before.version }),
        s.as(other).patch(path).send({ ...b, [key_]: before.version }),
      ]);
      const statuses = [first.status, second.status].sort();
      expect(statuses, `${JSON.stringify(first.body)} / ${JSON.stringify(second.body)}`).toEqual([200, 409]);
      const [won, lost] = first.status === 200 ? [first, second] : [second, first];
      expect(won.status).toBe(200);
      const winner = first.status === 200 ? NAMES.owner : NAMES[other];
      expect(lost.body.error).toMatchObject({ code: "version_conflict", changedBy: winner });
      expect(lost.body.error.message).toMatch(new RegExp(`^${winner} changed this .* after you opened it`));
      expect((lost.body.error.current as Record<string, number>)[key_]).toBe(before.version + 1);
      const after = await read(s, spec);
      expect(after.version).toBe(before.version + 1);

      // Saving again from the version now current lands.
      const again = await s.as(other).patch(path).send({ ...(won === first ? b : a), [key_]: after.version });
      expect(again.status).toBe(200);
      expect((await read(s, spec)).version).toBe(before.version + 2);
    });
  }

  it("PUT /api/plans/:id: owner and estimator save plan 1 at the same moment; the plan holds the one that landed", async () => {
    const s = await makeShop();
    const f = await fx(s);
    const plan = (await s.as("owner").get(`/api/plans/${f.jobPlan.id}`)).body;
    const doc = (name: string) => ({ name, layers: [], version: plan.version });
    const [o, e] = await Promise.all([s.as("owner").put(`/api/plans/${f.jobPlan.id}`).send(doc("Owner's plan")), s.as("estimator").put(`/api/plans/${f.jobPlan.id}`).send(doc("Estimator's plan"))]);
    expect([o.status, e.status].sort()).toEqual([200, 409]);
    const [won, lost, winnerName] = o.status === 200 ? [o, e, NAMES.owner] : [e, o, NAMES.estimator];
    expect(lost.body.error).toMatchObject({ code: "version_conflict", changedBy: winnerName, current: { name: won.body.name, version: plan.version + 1 } });
    expect((await s.as("owner").get(`/api/plans/${f.jobPlan.id}`)).body.name).toBe(won.body.name);
  });

  it("a save without the version it read is refused with 400 naming the field", async () => {
    const s = await makeShop();
    const res = await s.as("owner").patch(`/api/customers/${s.customerA.id}`).send({ name: "No version" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["version"]);
    expect((await s.as("owner").get(`/api/customers/${s.customerA.id}`)).body.name).not.toBe("No version");
  });
});
