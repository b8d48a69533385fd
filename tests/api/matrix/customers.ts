import { office, type MatrixRows } from "./rows";


export const rows: MatrixRows = {
  "GET /api/customers": { path: () => "/api/customers", expect: office(200) },
  "POST /api/customers": { path: () => "/api/customers", body: () => ({ name: "Drew Kettle" }), expect: office(201) },
  "GET /api/customers/:id": { path: (s) => `/api/customers/${s.customerA.id}`, expect: office(200) },
  "PATCH /api/customers/:id": { path: (s) => `/api/customers/${s.customerA.id}`, body: () => ({ phone: "555-0100", version: 1 }), expect: office(200) },
  "DELETE /api/customers/:id": { path: (s) => `/api/customers/${s.spareCustomer.id}`, expect: office(204) },
};
