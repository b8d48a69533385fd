/** The words that make a JSON key a money field, as the issue names them (plus "cents", our money unit). */
export const MONEY_WORDS = ["price", "cost", "total", "amount", "rate", "cents"] as const;

/** "unitCostCents" → ["unit", "cost", "cents"]; "labour_rate" → ["labour", "rate"]. */
export const keyWords = (key: string) =>
  key
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .split(/[\s_-]+/)
    .map((w) => w.toLowerCase())
    .filter(Boolean);

export const isMoneyKey = (key: string) => keyWords(key).some((w) => (MONEY_WORDS as readonly string[]).includes(w));

/**
 * Keys with a money word that hold counts or measured volumes, each with what it is. Key: "<route prefix> <key
 * path>", or just "<key path>" for any route.
 */
export const NOT_MONEY: Record<string, string> = {
  ".total": "any list: number of rows matching its filters (paging)",
  "/api/jobs/board .columns[].total": "number of jobs in a board column",
  "/api/jobs/:id/plan .estimate.totalAreaM2": "surface area to paint, m²",
  "/api/jobs/:id/plan .estimate.totalVolumeMl": "paint to mix for the plan, mL",
  "/api/mix-sheets .amount": "the batch size or amount on hand the painter entered, in the sheet's unit",
  "/api/solvent-uses .amount": "solvent used (wax and grease remover, gun wash), in the unit entered",
  "/api/solvent-uses [].amount": "list of solvent uses: each one's volume in the unit entered",
  "/api/mix-sheets .total": "batch volume in the sheet's unit",
  "/api/mix-sheets .totalMl": "batch volume, mL",
  "/api/mix-sheets .roundedTotal": "batch volume after rounding to measurable steps, in the sheet's unit",
  "/api/mix-sheets .lines[].amount": "how much of one component to pour or weigh",
  "/api/mix-sheets [].total": "list of a job's sheets: each batch's volume in its unit",
  "/api/mix-sheets [].totalMl": "list of a job's sheets: each batch's volume, mL",
  "/api/jobs/:id/finish-record .layers[].batches[].totalMl": "finish record: each recorded batch's volume, mL",
};

/** True when a money-word key at "<route> <key path>" is one of the listed counts or volumes (keys match by route prefix). */
export function listedNotMoney(routeAndPath: string) {
  const [route, path] = routeAndPath.split(" ") as [string, string];
  return Object.keys(NOT_MONEY).some((k) => {
    const [r, p] = k.split(" ") as [string, string | undefined];
    return p === undefined ? r === path : p === path && route.startsWith(r);
  });
}

