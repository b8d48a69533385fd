import { staff, type MatrixRows } from "./rows";


export const rows: MatrixRows = {
  "POST /api/mix/compute": {
    path: () => "/api/mix/compute",
    body: () => ({ components: [{ name: "clear", parts: 4 }, { name: "hardener", parts: 1 }], mode: "total", amount: 500, unit: "mL" }),
    expect: staff(200),
  },
};
