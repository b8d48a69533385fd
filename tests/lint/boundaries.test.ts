import { describe, expect, it } from "vitest";
import path from "node:path";
import { ESLint } from "eslint";

/** The boundary rules of eslint.config.js, run on small sources placed where a real file would be. */
const root = path.resolve(import.meta.dirname, "../..");
const eslint = new ESLint({ cwd: root });

async function problems(file: string, source: string) {
  const [result] = await eslint.lintText(source, { filePath: path.join(root, file) });
  return result!.messages.map((m) => `${m.ruleId}: ${m.message}`);
}
const use = (spec: string) => `import * as x from "${spec}";\nexport const y = x;\n`;

describe("import boundaries", () => {
  it("the client cannot import server code, by alias-free relative path", async () => {
    expect(await problems("src/features/jobs/api/x.ts", use("../../../../server/db/client"))).toEqual([
      expect.stringMatching(/^no-restricted-imports: .*never imports server code/),
    ]);
    expect(await problems("src/lib/x.ts", use("../../server/http/http-error"))).toHaveLength(1);
  });

  it("server and shared code cannot import the client; shared cannot import the server", async () => {
    expect(await problems("server/modules/jobs/x.ts", use("@/lib/api-client"))).toEqual([expect.stringMatching(/never import the client/)]);
    expect(await problems("server/modules/jobs/x.ts", use("../../../src/lib/api-client"))).toEqual([expect.stringMatching(/never import the client/)]);
    expect(await problems("shared/domain/x.ts", use("../../src/lib/api-client"))).toEqual([expect.stringMatching(/never import the client/)]);
    expect(await problems("shared/domain/x.ts", use("../../server/db/client"))).toEqual([expect.stringMatching(/imports neither/)]);
  });

  it("a feature cannot import from src/app", async () => {
    expect(await problems("src/features/jobs/components/x.tsx", use("@/app/router"))).toEqual([expect.stringMatching(/does not import from src\/app/)]);
    expect(await problems("src/features/jobs/components/x.tsx", use("../../../app/routes/staff/jobs"))).toEqual([expect.stringMatching(/does not import from src\/app/)]);
  });

  it("a feature imports another only where the declared list allows it", async () => {
    expect(await problems("src/features/jobs/components/x.tsx", use("@/features/quotes/api/quotes.queries"))).toEqual([
      expect.stringMatching(/CROSS_FEATURE\.jobs/),
    ]);
    expect(await problems("src/features/jobs/components/x.tsx", use("../../quotes/api/quotes.queries"))).toEqual([expect.stringMatching(/CROSS_FEATURE\.jobs/)]);
    expect(await problems("src/features/jobs/components/sub/x.tsx", use("../../../quotes/api/quotes.queries"))).toEqual([expect.stringMatching(/CROSS_FEATURE\.jobs/)]);
    // A sub-folder named like a feature is the feature's own: not caught.
    expect(await problems("src/features/booth/components/sub/x.tsx", use("../prep/thing"))).toEqual([]);
    // Declared: the quote's payments panel uses the payments feature. A feature's own files and shared code are free.
    expect(await problems("src/features/quotes/components/x.tsx", use("@/features/payments/api/payments.queries"))).toEqual([]);
    expect(await problems("src/features/jobs/components/x.tsx", use("@/features/jobs/api/jobs.queries"))).toEqual([]);
    expect(await problems("src/features/jobs/components/x.tsx", use("@shared/schemas/job.schema"))).toEqual([]);
  });

  it("an eslint-disable comment that silences nothing is an error", async () => {
    const out = await problems("src/lib/x.ts", "// eslint-disable-next-line no-console -- not needed\nexport const z = 1;\n");
    expect(out.join("\n")).toMatch(/Unused eslint-disable directive/);
  });
});
