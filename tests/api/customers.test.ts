import { describe, expect, it } from "vitest";
import { addCustomer, addJob, makeShop, editAt } from "../support/test-app";

describe("customers", () => {
  it("creates, edits and reads a customer, normalising the e-mail", async () => {
    const s = await makeShop();
    const res = await s.as("estimator").post("/api/customers").send({ name: "Quinn Harlow", email: " Quinn@Example.TEST ", phone: "", notes: "Met at the bike show" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: "Quinn Harlow", email: "quinn@example.test", phone: null, notes: "Met at the bike show", jobCount: 0 });
    const edit = await editAt(s, "estimator", `/api/customers/${res.body.id}`, { phone: "555-0119" });
    expect(edit.body).toMatchObject({ phone: "555-0119", name: "Quinn Harlow" });
  });

  it("rejects a missing name and a bad e-mail with field messages", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/customers").send({ name: " ", email: "quinn-at-example" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({ name: "Name is required", email: "Enter a valid email address" });
  });

  it("counts jobs, sorts and searches on the server", async () => {
    const s = await makeShop();
    addJob(s, s.customerB.id);
    addJob(s, s.customerB.id);
    const byJobs = await s.as("owner").get("/api/customers?sort=-jobCount");
    expect(byJobs.body.items[0]).toMatchObject({ name: "Blake Moor", jobCount: 3 });
    expect(byJobs.body.items.find((c: { name: string }) => c.name === "Casey Nobody").jobCount).toBe(0);
    const found = await s.as("owner").get("/api/customers?q=aver");
    expect(found.body.items.map((c: { name: string }) => c.name)).toEqual(["Avery Stone"]);
  });

  it("the searchable pick list finds a customer past the first 100 by name or e-mail, one page at a time", async () => {
    const s = await makeShop();
    for (let i = 0; i < 120; i++) addCustomer(s, `Customer ${String(i).padStart(3, "0")}`);
    const late = await s.as("estimator").post("/api/customers").send({ name: "Zora Quill", email: "zora@quill.test" });
    // The old pick list loaded the first 100 by name: Zora was not in it.
    const first100 = await s.as("estimator").get("/api/customers?pageSize=100&sort=name");
    expect(first100.body.items.some((c: { id: number }) => c.id === late.body.id)).toBe(false);
    expect(first100.body.total).toBe(124);
    // What the picker asks for as the user types (src/features/customers/api/customers.queries.ts, search).
    const typed = await s.as("estimator").get("/api/customers?pageSize=20&sort=name&q=zora");
    expect(typed.body.items.map((c: { name: string }) => c.name)).toEqual(["Zora Quill"]);
    expect((await s.as("estimator").get("/api/customers?pageSize=20&sort=name&q=quill.test")).body.total).toBe(1);
    const page = await s.as("estimator").get("/api/customers?pageSize=20&sort=name&q=Customer");
    expect(page.body).toMatchObject({ total: 120, pageSize: 20 });
    expect(page.body.items).toHaveLength(20);
    // What is typed is found as typed: "%" and "_" are not wildcards.
    await s.as("estimator").post("/api/customers").send({ name: "Shop_100 Percent" });
    expect((await s.as("estimator").get("/api/customers?q=%25")).body.total).toBe(0);
    expect((await s.as("estimator").get("/api/customers?q=p_1")).body.items.map((c: { name: string }) => c.name)).toEqual(["Shop_100 Percent"]);
  });

  it("will not delete a customer with jobs (409) and deletes one without", async () => {
    const s = await makeShop();
    const refused = await s.as("owner").delete(`/api/customers/${s.customerB.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/has 1 job/);
    expect((await s.as("owner").delete(`/api/customers/${s.spareCustomer.id}`)).status).toBe(204);
    expect((await s.as("owner").get(`/api/customers/${s.spareCustomer.id}`)).status).toBe(404);
  });

  it("answers a non-numeric id with 400, not a 500", async () => {
    const s = await makeShop();
    const res = await s.as("owner").get("/api/customers/abc");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("id");
  });
});
