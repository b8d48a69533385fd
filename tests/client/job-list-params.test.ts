import { describe, expect, it } from "vitest";
import { OPEN_STAGES, STAGES } from "../../shared/domain/stages";
import { listJobsQuerySchema } from "../../shared/schemas/job.schema";
import { readJobListParams, stageParamFor } from "../../src/features/jobs/hooks/use-job-list-params";

/** The jobs table reads its filters from the URL; the route's prefetch and the table must ask the API the same thing. */
const read = (search: string) => readJobListParams(new URLSearchParams(search));

/** What the API client sends for a query object (arrays comma-joined, empty values left out), as the server parses it. */
const asServerSees = (query: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(query).map(([k, v]) => [k, Array.isArray(v) ? v.join(",") : String(v)]));

describe("the jobs table's URL → API query", () => {
  it("no parameters: open work, first page of 25, by due date", () => {
    expect(read("").query).toEqual({ page: 1, pageSize: 25, sort: "dueDate", stage: [...OPEN_STAGES] });
    expect(read("").filtered).toBe(false);
  });

  it("every filter is carried over, and ?stage=all lifts the stage filter", () => {
    const r = read("q=tank&stage=all&due=week&painter=u-7&customer=12&sort=-title&page=3&pageSize=50");
    expect(r.query).toEqual({ page: 3, pageSize: 50, sort: "-title", q: "tank", due: "week", painterId: "u-7", customerId: 12 });
    expect(r.stages).toEqual([]);
    expect(r.filtered).toBe(true);
  });

  it("values the server would refuse fall back to the defaults instead of failing the screen", () => {
    const r = read("sort=price&pageSize=33&page=-2&due=someday&customer=x&stage=booked,nonsense,ready");
    expect(r.query).toEqual({ page: 1, pageSize: 25, sort: "dueDate", stage: ["booked", "ready"] });
  });

  it("what it asks for is what the server's own schema accepts", () => {
    for (const search of ["", "stage=all", "q=tank&stage=booked,in_booth&due=overdue&painter=u-7&customer=12&sort=-updatedAt&page=2&pageSize=100"]) {
      const parsed = listJobsQuerySchema.safeParse(asServerSees(read(search).query));
      expect(parsed.success, search).toBe(true);
    }
  });

  it("choosing the open stages again writes no ?stage= (the default), every stage writes all", () => {
    expect(stageParamFor([...OPEN_STAGES])).toBeNull();
    expect(stageParamFor([...STAGES])).toBe("all");
    expect(read(`stage=${stageParamFor(["ready", "booked"])}`).stages).toEqual(["booked", "ready"]);
  });
});
