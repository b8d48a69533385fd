import { describe, expect, it } from "vitest";
import request from "supertest";
import { makeShop, editAt } from "../support/test-app";

describe("users (owner)", () => {
  it("creates a user who can then sign in, with the chosen role", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/users").send({ email: "New.Painter@Shop.test", name: "Nell Painter", role: "painter", password: "a-long-password" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: "new.painter@shop.test", role: "painter", active: true });
    expect(res.body).not.toHaveProperty("passwordHash");
    const signIn = await request(s.app).post("/api/auth/sign-in").send({ email: "new.painter@shop.test", password: "a-long-password" });
    expect(signIn.status).toBe(200);
  });

  it("refuses a duplicate e-mail (409) and a customer account with no customer (400)", async () => {
    const s = await makeShop();
    const dup = await s.as("owner").post("/api/users").send({ email: s.painter.email, name: "Again", role: "painter", password: "a-long-password" });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields).toHaveProperty("email");
    const loose = await s.as("owner").post("/api/users").send({ email: "c@shop.test", name: "Cust", role: "customer", password: "a-long-password" });
    expect(loose.status).toBe(400);
    expect(loose.body.error.fields).toHaveProperty("customerId");
  });

  it("changing a role or switching a user off ends their sessions", async () => {
    const s = await makeShop();
    const res = await editAt(s, "owner", `/api/users/${s.estimator.id}`, { role: "painter" });
    expect(res.body.role).toBe("painter");
    expect((await s.as("estimator").get("/api/auth/me")).status).toBe(401);
    await editAt(s, "owner", `/api/users/${s.painter.id}`, { active: false });
    expect((await s.as("painter").get("/api/auth/me")).status).toBe(401);
  });

  it("keeps at least one active owner and stops owners locking themselves out", async () => {
    const s = await makeShop();
    const self = await editAt(s, "owner", `/api/users/${s.owner.id}`, { active: false });
    expect(self.status).toBe(409);
    expect((await s.as("owner").get("/api/auth/me")).status).toBe(200);
  });

  it("lists painters for the office to assign jobs", async () => {
    const s = await makeShop();
    const res = await s.as("estimator").get("/api/painters");
    expect(res.body.map((p: { id: string }) => p.id).sort()).toEqual([s.painter.id, s.painter2.id].sort());
    expect(Object.keys(res.body[0]).sort()).toEqual(["id", "name"]);
  });

  it("searches people on the server by name or e-mail for the audit trail's who filter", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/users").send({ email: "rowan.vale@shop.test", name: "Rowan Vale", role: "estimator", password: "a-long-password" });
    expect(res.status).toBe(201);
    const byName = await s.as("owner").get("/api/users?pageSize=20&sort=name&q=rowan");
    expect(byName.body.items.map((u: { name: string }) => u.name)).toEqual(["Rowan Vale"]);
    expect((await s.as("owner").get("/api/users?pageSize=20&sort=name&q=vale@shop")).body.total).toBe(1);
    expect((await s.as("owner").get(`/api/users/${res.body.id}`)).body.name).toBe("Rowan Vale");
    expect((await s.as("estimator").get("/api/users?q=rowan")).status).toBe(403);
  });
});
