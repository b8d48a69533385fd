import { describe, expect, it } from "vitest";
import { makeShop, type Shop, editAt } from "../support/test-app";
import { addPanel, addPhoto } from "../support/booth-fixtures";
import { auditLog } from "../../server/db/schema";

/**
 * Sharma, Wu & Dalal (2005), "The CIEDE2000 color-difference formula: Implementation notes, supplementary test
 * data, and mathematical observations", Color Res. Appl. 30(1):21–30, Table 1 (shared/references.md §5a).
 */
const SHARMA = {
  7: { lab1: { L: 50, a: 0, b: 0 }, lab2: { L: 50, a: -1, b: 2 }, dE: 2.3669 },
  8: { lab1: { L: 50, a: -1, b: 2 }, lab2: { L: 50, a: 0, b: 0 }, dE: 2.3669 },
  17: { lab1: { L: 50, a: 2.5, b: 0 }, lab2: { L: 73, a: 25, b: -18 }, dE: 27.1492 },
  25: { lab1: { L: 60.2574, a: -34.0099, b: 36.2677 }, lab2: { L: 60.4626, a: -34.1751, b: 39.4387 }, dE: 1.2644 },
  33: { lab1: { L: 6.7747, a: -0.2908, b: -2.4247 }, lab2: { L: 5.8714, a: -0.0985, b: -2.2286 }, dE: 0.6377 },
  34: { lab1: { L: 2.0776, a: 0.0795, b: -1.135 }, lab2: { L: 0.9033, a: -0.0636, b: -0.5514 }, dE: 0.9082 },
} as const;

const labCols = (lab: { L: number; a: number; b: number }) => ({ labL: lab.L, labA: lab.a, labB: lab.b });

/** Job A approves a panel with lab1; a new panel for job A has lab2. */
async function approvedPair(s: Shop, pair: keyof typeof SHARMA) {
  const approved = addPanel(s, { ...labCols(SHARMA[pair].lab1), jobId: s.jobA.id });
  await s.as("owner").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: approved.id });
  const created = await s.as("painter").post("/api/panels").send({ groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4, jobId: s.jobA.id, ...labCols(SHARMA[pair].lab2) });
  expect(created.status).toBe(201);
  return created.body;
}

describe("colour difference of a new panel against the job's approved one", () => {
  it.each([
    [34, "match"],
    [33, "match"],
    [25, "close"],
    [7, "different"],
    [17, "different"],
  ] as const)("Sharma et al. 2005 pair %i reads %s with the default thresholds (match < 1, close < 2)", async (pair, verdict) => {
    const s = await makeShop();
    const panel = await approvedPair(s, pair);
    expect(panel.vsApproved.deltaE).toBeCloseTo(SHARMA[pair].dE, 4);
    expect(panel.vsApproved.verdict).toBe(verdict);
    const words = { match: "Within tolerance", close: "Borderline", different: "Out of tolerance" }[verdict];
    expect(panel.vsApproved.text).toMatch(new RegExp(`^${words} \\(ΔE00 ${SHARMA[pair].dE.toFixed(2)}\\): `));
  });

  it("is symmetric (Sharma pairs 7 and 8 give the same 2.3669)", async () => {
    const s = await makeShop();
    const p7 = await approvedPair(s, 7);
    const t = await makeShop();
    const p8 = await approvedPair(t, 8);
    expect(p7.vsApproved.deltaE).toBeCloseTo(2.3669, 4);
    expect(p8.vsApproved.deltaE).toBeCloseTo(2.3669, 4);
  });

  it("follows the shop's own thresholds from settings", async () => {
    const s = await makeShop();
    expect((await editAt(s, "owner", "/api/settings", { deltaEMatch: 0.5, deltaEClose: 3 })).status).toBe(200);
    const p34 = await approvedPair(s, 34);
    expect(p34.vsApproved.verdict).toBe("close"); // 0.9082 ≥ 0.5, < 3
    const colour = await s.as("painter").get(`/api/jobs/${s.jobA.id}/colour`);
    expect(colour.body.thresholds).toEqual({ deltaEMatch: 0.5, deltaEClose: 3 });
    const p7 = colour.body.panels.find((p: { id: number }) => p.id === p34.id);
    expect(p7.vsApproved.verdict).toBe("close");
  });

  it("shows no difference when either panel has no reading", async () => {
    const s = await makeShop();
    const approved = addPanel(s, { jobId: s.jobA.id });
    await s.as("owner").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: approved.id });
    const res = await s.as("painter").post("/api/panels").send({ groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4, jobId: s.jobA.id, ...labCols(SHARMA[34].lab2) });
    expect(res.body.vsApproved).toBeNull();
  });
});

describe("the approved colour of a job", () => {
  it("the office sets and clears it, audited; painters and customers read it; customers get no shop notes and only shared photos", async () => {
    const s = await makeShop();
    const panel = addPanel(s, { jobId: s.jobA.id, notes: "Internal: toner lot running low", ...labCols(SHARMA[25].lab1) });
    const privatePhoto = await addPhoto(s, { ownerType: "panel", ownerId: panel.id, jobId: s.jobA.id });
    expect((await s.as("painter").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: panel.id })).status).toBe(403);
    const set = await s.as("estimator").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: panel.id });
    expect(set.body.approvedPanel).toMatchObject({ id: panel.id, isApprovedForJob: true, notes: "Internal: toner lot running low" });
    expect(set.body.approvedPanel.photo.id).toBe(privatePhoto.id);
    const audit = s.db.select().from(auditLog).all().find((a) => a.entity === "job_colour")!;
    expect(audit).toMatchObject({ kind: "plan", action: "approved", after: { approvedPanelId: panel.id } });

    const mine = await s.as("customer").get(`/api/jobs/${s.jobA.id}/colour`);
    expect(mine.status).toBe(200);
    expect(mine.body.approvedPanel).toMatchObject({ id: panel.id, notes: null, photo: null });
    expect((await s.as("customer").get(`/api/jobs/${s.jobB.id}/colour`)).status).toBe(404);

    const cleared = await s.as("owner").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: null });
    expect(cleared.body.approvedPanel).toBeNull();
    expect((await s.as("owner").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: 9999 })).status).toBe(400);
  });

  it("a panel that is a job's approved colour cannot be deleted", async () => {
    const s = await makeShop();
    const panel = addPanel(s);
    await s.as("owner").put(`/api/jobs/${s.jobA.id}/approved-panel`).send({ panelId: panel.id });
    const res = await s.as("owner").delete(`/api/panels/${panel.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/approved colour of job/);
  });
});

describe("the panel library", () => {
  it("filters by ground, candy and coats, and lists the choices for each filter", async () => {
    const s = await makeShop();
    addPanel(s, { groundName: "Fine silver", candyName: "Candy garnet", coats: 3 });
    addPanel(s, { groundName: "Fine silver", candyName: "Candy garnet", coats: 5 });
    addPanel(s, { groundName: "Gold flake", candyName: "Candy garnet", coats: 3 });
    addPanel(s, { groundName: "Gold flake", candyName: "Candy tangerine", coats: 4 });
    const all = await s.as("painter").get("/api/panels");
    expect(all.body.total).toBe(4);
    expect(all.body.facets).toEqual({ grounds: ["Fine silver", "Gold flake"], candies: ["Candy garnet", "Candy tangerine"], coats: [3, 4, 5] });
    const garnet3 = await s.as("painter").get("/api/panels?candy=candy%20garnet&coats=3");
    expect(garnet3.body.items.map((p: { label: string }) => p.label)).toEqual(["Candy garnet over Fine silver, 6:1, 3 coats", "Candy garnet over Gold flake, 6:1, 3 coats"]);
    const gold = await s.as("painter").get("/api/panels?ground=Gold%20flake");
    expect(gold.body.total).toBe(2);
    expect((await s.as("painter").get("/api/panels?coats=lots")).status).toBe(400);
  });

  it("compares panels side by side with ΔE00 for each pair that has readings", async () => {
    const s = await makeShop();
    const a = addPanel(s, labCols(SHARMA[17].lab1));
    const b = addPanel(s, labCols(SHARMA[17].lab2));
    const c = addPanel(s);
    const res = await s.as("painter").get(`/api/panels/compare?ids=${a.id},${b.id},${c.id}`);
    expect(res.body.panels.map((p: { id: number }) => p.id)).toEqual([a.id, b.id, c.id]);
    expect(res.body.pairs).toHaveLength(1);
    expect(res.body.pairs[0]).toMatchObject({ a: a.id, b: b.id, verdict: "different" });
    expect(res.body.pairs[0].deltaE).toBeCloseTo(27.1492, 4); // Sharma et al. 2005 pair 17
    expect((await s.as("painter").get(`/api/panels/compare?ids=${a.id}`)).status).toBe(400);
    expect((await s.as("painter").get(`/api/panels/compare?ids=${a.id},424242`)).status).toBe(404);
  });

  it("the depth ladder orders one candy over one ground by coats and gives equivalent coats at a new let-down", async () => {
    const s = await makeShop();
    for (const coats of [6, 3, 4, 5]) addPanel(s, { coats, letDownClear: 6, letDownToner: 1 });
    addPanel(s, { coats: 4, groundName: "Gold flake" });
    const res = await s.as("painter").get("/api/panels/ladder?ground=fine%20silver&candy=Candy%20garnet&toClear=8&toToner=1");
    expect(res.status).toBe(200);
    expect(res.body.rungs.map((r: { panel: { coats: number } }) => r.panel.coats)).toEqual([3, 4, 5, 6]);
    expect(res.body.reference.tonerFraction).toBeCloseTo(1 / 9, 12); // 8:1 → f = 1/9 (references.md §6)
    const eq = res.body.rungs.map((r: { equivalentCoats: number }) => r.equivalentCoats);
    // references.md §6 (Beer–Lambert, n₂ = n₁·f₁/f₂): 3 / 4 / 5 / 6 coats at 6:1 are as deep as 3.857 / 5.142857 / 6.429 / 7.714 at 8:1.
    expect(eq[1]).toBeCloseTo(5.142857, 6);
    expect(eq[1]).not.toBeCloseTo(5.333333, 3); // the common mistake (toner per part clear) must not match
    expect(eq[0]).toBeCloseTo(3.857, 3);
    expect(eq[2]).toBeCloseTo(6.429, 3);
    expect(eq[3]).toBeCloseTo(7.714, 3);
    expect(res.body.rungs[1].depth).toBeCloseTo(4 / 7, 12); // f × n = 4/7 at 6:1
    // Without a target ratio the first rung's let-down is the reference, so equivalent coats equal the coats.
    const own = await s.as("painter").get("/api/panels/ladder?ground=Fine%20silver&candy=Candy%20garnet");
    expect(own.body.rungs.map((r: { equivalentCoats: number }) => r.equivalentCoats)).toEqual([3, 4, 5, 6]);
    expect((await s.as("painter").get("/api/panels/ladder?ground=Chrome&candy=Candy%20garnet")).status).toBe(404);
    expect((await s.as("painter").get("/api/panels/ladder?ground=Fine%20silver&candy=Candy%20garnet&toClear=8")).status).toBe(400);
  });

  it("asks for L*, a* and b* together, and checks the ranges", async () => {
    const s = await makeShop();
    const res = await s.as("painter").post("/api/panels").send({ groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4, labL: 40 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["labA", "labB"]);
    const range = await s.as("painter").post("/api/panels").send({ groundName: "", candyName: "Candy garnet", letDownClear: 0, letDownToner: 1, coats: 0.5, labL: 140, labA: 0, labB: 0 });
    expect(Object.keys(range.body.error.fields).sort()).toEqual(["coats", "labL", "letDownClear"]);
    // No ground at all: it is asked for where it is picked from the catalogue.
    const noGround = await s.as("painter").post("/api/panels").send({ groundName: "", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4 });
    expect(Object.keys(noGround.body.error.fields)).toEqual(["groundMaterialId"]);
    const p = addPanel(s, { createdBy: s.painter.id });
    const half = await editAt(s, "painter", `/api/panels/${p.id}`, { labL: 20 });
    expect(half.status).toBe(400);
  });

  it("painters change only the panels they made; the office any; only the office deletes", async () => {
    const s = await makeShop();
    const mine = addPanel(s, { createdBy: s.painter.id });
    const theirs = addPanel(s, { createdBy: s.owner.id });
    expect((await editAt(s, "painter", `/api/panels/${mine.id}`, { coats: 5 })).body.coats).toBe(5);
    expect((await editAt(s, "painter", `/api/panels/${theirs.id}`, { coats: 5 })).status).toBe(403);
    expect((await editAt(s, "estimator", `/api/panels/${theirs.id}`, { coats: 5 })).status).toBe(200);
    expect((await s.as("painter").delete(`/api/panels/${mine.id}`)).status).toBe(403);
    expect((await s.as("owner").delete(`/api/panels/${mine.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/panels/${mine.id}`)).status).toBe(404);
  });

  it("a painter sees the job title only on panels of their own jobs", async () => {
    const s = await makeShop();
    const other = addPanel(s, { jobId: s.jobB.id });
    const own = addPanel(s, { jobId: s.jobA.id });
    expect((await s.as("painter").get(`/api/panels/${other.id}`)).body).toMatchObject({ jobId: null, jobTitle: null });
    expect((await s.as("painter").get(`/api/panels/${own.id}`)).body).toMatchObject({ jobId: s.jobA.id, jobTitle: "Helmet in candy teal" });
    expect((await s.as("painter").post("/api/panels").send({ groundName: "g", candyName: "c", letDownClear: 6, letDownToner: 1, coats: 2, jobId: s.jobB.id })).status).toBe(400);
  });
});
