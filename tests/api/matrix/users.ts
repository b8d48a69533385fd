import { office, ownerOnly, type MatrixRows } from "./rows";


export const rows: MatrixRows = {
  "GET /api/users": { path: () => "/api/users", expect: ownerOnly(200) },
  "POST /api/users": {
    path: () => "/api/users",
    body: () => ({ email: "new.painter@shop.test", name: "New Painter", role: "painter", password: "a-long-password" }),
    expect: ownerOnly(201),
  },
  "GET /api/users/:id": { path: (s) => `/api/users/${s.painter.id}`, expect: ownerOnly(200) },
  "PATCH /api/users/:id": { path: (s) => `/api/users/${s.painter.id}`, body: () => ({ name: "Renamed", version: 1 }), expect: ownerOnly(200) },
  "GET /api/painters": { path: () => "/api/painters", expect: office(200) },
};
