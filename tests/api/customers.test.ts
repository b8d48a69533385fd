import { describe, expect, it } from "vitest";
import { addJob, makeShop, editAt } from "../support/test-app";

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
