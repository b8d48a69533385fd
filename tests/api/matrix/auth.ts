import { all, signedIn, type MatrixRows } from "./rows";


export const rows: MatrixRows = {
  "POST /api/auth/sign-in": {
    path: () => "/api/auth/sign-in",
    body: () => ({ email: "nobody@shop.test", password: "wrong-password" }),
    expect: all(401),
  },
  "POST /api/auth/sign-out": { path: () => "/api/auth/sign-out", expect: all(204) },
  "GET /api/auth/me": { path: () => "/api/auth/me", expect: signedIn(200) },
  "POST /api/auth/password-reset": { path: () => "/api/auth/password-reset", body: () => ({ email: "nobody@shop.test" }), expect: all(202) },
  "POST /api/auth/password-reset/confirm": {
    path: () => "/api/auth/password-reset/confirm",
    body: () => ({ token: "x".repeat(43), password: "a-long-new-password" }),
    expect: all(400),
  },
  "POST /api/auth/password": {
    path: () => "/api/auth/password",
    body: () => ({ currentPassword: "not-the-password", newPassword: "a-long-new-password" }),
    expect: signedIn(400),
  },
};
