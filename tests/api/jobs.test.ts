import { describe, expect, it } from "vitest";
import { addJob, makeShop } from "../support/test-app";

describe("jobs: create, read, list", () => {
  it("creates a job in the inquiry stage, records who created it, and reads it back", async () => {
    const s = await makeShop();
    const res = await s
      .as("estimator")
      .post("/api/jobs")
      .send({ customerId: s.customerB.id, title: "  Truck hood in candy copper ", dueDate: "2027-01-15", assignedPainterId: s.painter.id, notes: "Hood has a dent to fill" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      title: "Truck hood in candy copper",
      stage: "inquiry",
      dueDate: "2027-01-15",
      customerName: "Blake Moor",
      assignedPainterId: s.painter.id,
      notes: "Hood has a dent to fill",
      items: [],
    });
    expect(res.body.events).toHaveLength(1);
    expect(res.body.events[0]).toMatchObject({ fromStage: null, toStage: "inquiry", byName: "Test estimator" });
    const read = await s.as("owner").get(`/api/jobs/${res.body.id}`);
    expect(read.body.title).toBe("Truck hood in candy copper");
  });

  it("answers bad bodies with 400 and a message per field, and saves nothing", async () => {
    const s = await makeShop();
    const before = (await s.as("owner").get("/api/jobs")).body.total;
    const res = await s.as("owner").post("/api/jobs").send({ customerId: "abc", title: "", dueDate: "next tuesday", assignedPainterId: 5 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["assignedPainterId", "customerId", "dueDate", "title"]);
    expect((await s.as("owner").get("/api/jobs")).body.total).toBe(before);
  });

  it("refuses an unknown customer or a non-painter as the assignee, naming the field", async () => {
    const s = await makeShop();
    const noCustomer = await s.as("owner").post("/api/jobs").send({ customerId: 9999, title: "Helmet" });
    expect(noCustomer.status).toBe(400);
    expect(noCustomer.body.error.fields).toHaveProperty("customerId");
    const notPainter = await s.as("owner").post("/api/jobs").send({ customerId: s.customerA.id, title: "Helmet", assignedPainterId: s.estimator.id });
    expect(notPainter.status).toBe(400);
    expect(notPainter.body.error.fields).toHaveProperty("assignedPainterId");
  });

  it("lists with server-side paging, sorting, text search and stage filter", async () => {
    const s = await makeShop();
    for (let i = 1; i <= 12; i++) addJob(s, s.customerB.id, { title: `Fender ${String(i).padStart(2, "0")}`, stage: i % 2 ? "quoted" : "booked", dueDate: `2027-02-${String(i).padStart(2, "0")}` });
    const page2 = await s.as("owner").get("/api/jobs?q=fender&sort=-title&pageSize=5&page=2");
    expect(page2.status).toBe(200);
    expect(page2.body).toMatchObject({ total: 12, page: 2, pageSize: 5 });
    expect(page2.body.items.map((j: { title: string }) => j.title)).toEqual(["Fender 07", "Fender 06", "Fender 05", "Fender 04", "Fender 03"]);
    const quoted = await s.as("owner").get("/api/jobs?stage=quoted&q=fender");
    expect(quoted.body.total).toBe(6);
    expect(quoted.body.items.every((j: { stage: string }) => j.stage === "quoted")).toBe(true);
    const both = await s.as("owner").get("/api/jobs?stage=quoted,booked&sort=dueDate&pageSize=3");
    expect(both.body.items.map((j: { dueDate: string }) => j.dueDate)).toEqual(["2027-02-01", "2027-02-02", "2027-02-03"]);
    const byNumber = await s.as("owner").get(`/api/jobs?q=%23${s.jobB.id}`);
    expect(byNumber.body.items.map((j: { id: number }) => j.id)).toContain(s.jobB.id);
  });

  it("rejects unknown sort fields and stages with 400 naming the parameter", async () => {
    const s = await makeShop();
    const sort = await s.as("owner").get("/api/jobs?sort=price");
    expect(sort.status).toBe(400);
    expect(sort.body.error.fields).toHaveProperty("sort");
    const stage = await s.as("owner").get("/api/jobs?stage=painted");
    expect(stage.status).toBe(400);
    expect(Object.keys(stage.body.error.fields)[0]).toMatch(/^stage/);
    const page = await s.as("owner").get("/api/jobs?pageSize=5000");
    expect(page.status).toBe(400);
    expect(page.body.error.fields).toHaveProperty("pageSize");
  });

  it("filters overdue and due-this-week jobs against the shop's clock", async () => {
    const s = await makeShop({ now: () => new Date(2027, 2, 10, 12).getTime() });
    addJob(s, s.customerB.id, { title: "Late one", stage: "in_booth", dueDate: "2027-03-01" });
    addJob(s, s.customerB.id, { title: "Soon one", stage: "booked", dueDate: "2027-03-14" });
    addJob(s, s.customerB.id, { title: "Late but ready", stage: "ready", dueDate: "2027-03-01" });
    const overdue = await s.as("owner").get("/api/jobs?due=overdue");
    expect(overdue.body.items.map((j: { title: string }) => j.title)).toEqual(["Late one"]);
    const week = await s.as("owner").get("/api/jobs?due=week");
    expect(week.body.items.map((j: { title: string }) => j.title)).toEqual(["Soon one"]);
  });

  it("groups the board by stage with counts", async () => {
    const s = await makeShop();
    const board = await s.as("owner").get("/api/jobs/board");
    expect(board.status).toBe(200);
    expect(board.body.columns).toHaveLength(10);
    const prep = board.body.columns.find((c: { stage: string }) => c.stage === "in_prep");
    expect(prep.total).toBe(2);
    expect(prep.jobs.map((j: { id: number }) => j.id).sort()).toEqual([s.jobA.id, s.jobB.id].sort());
    const painterBoard = await s.as("painter").get("/api/jobs/board");
    const painterPrep = painterBoard.body.columns.find((c: { stage: string }) => c.stage === "in_prep");
    expect(painterPrep.jobs.map((j: { id: number }) => j.id)).toEqual([s.jobA.id]);
  });
});

describe("jobs: who sees what", () => {
  it("a painter lists and reads only the jobs assigned to them", async () => {
    const s = await makeShop();
    const list = await s.as("painter").get("/api/jobs?pageSize=100");
    const ids = list.body.items.map((j: { id: number }) => j.id);
    expect(ids.sort()).toEqual([s.jobA.id, s.inquiryA.id].sort());
    expect((await s.as("painter").get(`/api/jobs/${s.jobB.id}`)).status).toBe(404);
    expect((await s.as("painter").get(`/api/jobs/${s.jobB.id}/items`)).status).toBe(404);
  });

  it("a customer sees only their own jobs, without internal notes; another customer's job is 404", async () => {
    const s = await makeShop();
    const list = await s.as("customer").get("/api/jobs");
    expect(list.body.items.map((j: { customerId: number }) => j.customerId)).toEqual([s.customerA.id, s.customerA.id]);
    const own = await s.as("customer").get(`/api/jobs/${s.jobA.id}`);
    expect(own.status).toBe(200);
    expect(own.body).not.toHaveProperty("notes");
    expect(own.body.events).toEqual([]);
    expect(own.body.nextStages).toEqual([]);
    expect(JSON.stringify(own.body)).not.toContain("Internal: watch the vent holes");
    const other = await s.as("customer").get(`/api/jobs/${s.jobB.id}`);
    expect(other.status).toBe(404);
    expect(other.body.error.code).toBe("not_found");
    expect((await s.as("customer").get(`/api/jobs/${s.jobB.id}/items/${s.itemB.id}`)).status).toBe(404);
    expect((await s.as("customer").get(`/api/jobs?customerId=${s.customerB.id}`)).body.total).toBe(0);
  });

  it("an item id from another job is 404 even for the office", async () => {
    const s = await makeShop();
    expect((await s.as("owner").get(`/api/jobs/${s.jobA.id}/items/${s.itemB.id}`)).status).toBe(404);
  });
});

describe("jobs: stages", () => {
  it("records each move with who and when, and offers the next moves for the role", async () => {
    const s = await makeShop();
    const res = await s.as("painter").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "in_booth", note: "Masked and tacked" });
    expect(res.status).toBe(200);
    expect(res.body.stage).toBe("in_booth");
    expect(res.body.events[0]).toMatchObject({ fromStage: "in_prep", toStage: "in_booth", note: "Masked and tacked", byName: "Test painter" });
    expect(Date.parse(res.body.events[0].at)).toBeGreaterThan(Date.now() - 60_000);
    expect(res.body.nextStages.sort()).toEqual(["curing", "in_prep"]);
  });

  it("refuses a move the stage rules do not allow with 409", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "delivered" });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/cannot move from In prep to Delivered/);
    expect((await s.as("owner").get(`/api/jobs/${s.jobA.id}`)).body.stage).toBe("in_prep");
  });

  it("a painter cannot book a job (money) nor move a job that is not theirs", async () => {
    const s = await makeShop();
    const back = await s.as("painter").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "booked" });
    expect(back.status).toBe(409);
    const notMine = await s.as("painter").post(`/api/jobs/${s.jobB.id}/stage`).send({ stage: "in_booth" });
    expect(notMine.status).toBe(404);
  });

  it("an unknown stage is a 400 naming the field", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post(`/api/jobs/${s.jobA.id}/stage`).send({ stage: "sprayed" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("stage");
  });

  it("deletes only an inquiry; later jobs must be cancelled", async () => {
    const s = await makeShop();
    const refused = await s.as("owner").delete(`/api/jobs/${s.jobA.id}`);
    expect(refused.status).toBe(409);
    expect((await s.as("owner").get(`/api/jobs/${s.jobA.id}`)).status).toBe(200);
    expect((await s.as("owner").delete(`/api/jobs/${s.inquiryA.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/jobs/${s.inquiryA.id}`)).status).toBe(404);
  });
});

describe("job items", () => {
  it("adds, edits and removes parts with substrate and area", async () => {
    const s = await makeShop();
    const add = await s.as("estimator").post(`/api/jobs/${s.jobA.id}/items`).send({ name: "Chin bar", substrate: "plastic", surfaceArea: "0.05", areaUnit: "m2" });
    expect(add.status).toBe(201);
    expect(add.body).toMatchObject({ name: "Chin bar", substrate: "plastic", surfaceArea: 0.05, areaUnit: "m2", jobId: s.jobA.id });
    const edit = await s.as("estimator").patch(`/api/jobs/${s.jobA.id}/items/${add.body.id}`).send({ surfaceArea: 0.6, areaUnit: "ft2", version: add.body.version });
    expect(edit.body).toMatchObject({ surfaceArea: 0.6, areaUnit: "ft2", name: "Chin bar" });
    const list = await s.as("painter").get(`/api/jobs/${s.jobA.id}/items`);
    expect(list.body.map((i: { name: string }) => i.name)).toEqual(["Helmet shell", "Chin bar"]);
    expect((await s.as("estimator").delete(`/api/jobs/${s.jobA.id}/items/${add.body.id}`)).status).toBe(204);
    expect((await s.as("painter").get(`/api/jobs/${s.jobA.id}/items`)).body).toHaveLength(1);
  });

  it("rejects a zero area, an unknown substrate and a bad unit, naming each field", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post(`/api/jobs/${s.jobA.id}/items`).send({ name: "Tank", substrate: "cardboard", surfaceArea: 0, areaUnit: "acres" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["areaUnit", "substrate", "surfaceArea"]);
  });
});
