import fc from "fast-check";
import { z } from "zod";

/**
 * fast-check arbitraries for hostile input: odd scalars, wrong types, deep and huge values, malformed JSON,
 * query strings, path segments, headers and multipart parts.
 */
const oddStrings = [
  "", " ", "0", "-1", "1.5", "1e309", "NaN", "Infinity", "null", "true", "[]", "{}", "__proto__", "constructor",
  "9".repeat(30), "a".repeat(5000), "2026-02-30", "0000-00-00", "1970-01-01T00:00:00Z", "<script>alert(1)</script>",
  "' OR 1=1 --", "\u0000", "%", "%00", "../../etc/passwd", "\ud800", "🎨", "ﬀ", "\r\n", "candy_red", "owner",
];
const oddNumbers = [-1, 0, -0, 0.1, 1.5, 1e308, -1e308, 2 ** 31, 2 ** 53 + 2, Number.MIN_VALUE];

/** URL-encodes any JS string, dropping lone surrogates (which cannot be encoded). */
export const enc = (v: string) => encodeURIComponent(v.replace(/[\ud800-\udfff]/g, ""));

export const oddString = fc.oneof(fc.constantFrom(...oddStrings), fc.string({ unit: "binary", maxLength: 40 }));
/** Any JSON value a client could send where a field goes. */
export const oddValue: fc.Arbitrary<unknown> = fc.oneof(
  oddString,
  fc.constantFrom(...oddNumbers),
  fc.integer(),
  fc.double({ noNaN: true }),
  fc.constant(null),
  fc.boolean(),
  fc.jsonValue({ maxDepth: 3 }),
  fc.array(fc.jsonValue({ maxDepth: 1 }), { maxLength: 4 }),
);

type Step = { at: number; op: "replace" | "delete" | "wrap" | "add"; value: unknown; key: string };
const step: fc.Arbitrary<Step> = fc.record({ at: fc.nat(), op: fc.constantFrom("replace", "delete", "wrap", "add"), value: oddValue, key: oddString });

/** Every object/array node and leaf position in a JSON value, as paths of keys. */
function positions(v: unknown, at: (string | number)[] = []): (string | number)[][] {
  const here = [at];
  if (Array.isArray(v)) return here.concat(v.flatMap((x, i) => positions(x, [...at, i])));
  if (v && typeof v === "object") return here.concat(Object.entries(v).flatMap(([k, x]) => positions(x, [...at, k])));
  return here;
}

function apply(body: unknown, s: Step): unknown {
  const root = structuredClone(body ?? {});
  const all = positions(root);
  const path = all[s.at % all.length]!;
  if (path.length === 0) return s.op === "replace" ? s.value : s.op === "wrap" ? [root] : root;
  type Node = Record<string | number, unknown>;
  const parent = path.slice(0, -1).reduce<Node>((o, k) => o[k] as Node, root as Node);
  const key = path[path.length - 1]!;
  if (s.op === "replace") parent[key] = s.value;
  else if (s.op === "delete") {
    if (Array.isArray(parent)) parent.splice(Number(key), 1);
    else delete parent[key];
  }
  else if (s.op === "wrap") parent[key] = [parent[key]];
  else if (parent && typeof parent === "object" && !Array.isArray(parent)) parent[s.key] = s.value;
  return root;
}

/** A valid body with one to four fields replaced, deleted, wrapped in an array or joined by junk. */
export const mutatedBody = (valid: unknown) => fc.array(step, { minLength: 1, maxLength: 4 }).map((steps) => steps.reduce(apply, valid));

/** Text sent as application/json that is not JSON, or JSON of the wrong shape, or very deep/large. */
export const rawJson = fc.oneof(
  fc.string({ unit: "binary", maxLength: 80 }),
  fc.constantFrom('{"a":', "{'a':1}", "[1,2", "nul", '{"__proto__":{"admin":true}}', '{"constructor":{"prototype":{"x":1}}}', "[".repeat(3000), '{"a":'.repeat(2000), '"' + "x".repeat(300_000) + '"'),
  oddValue.map((v) => JSON.stringify(v) ?? "null"),
);

/** The keys of every *QuerySchema in shared/schemas, so query fuzzing uses the names the routes read. */
export function queryKeys(modules: Record<string, Record<string, unknown>>): string[] {
  const keys = new Set(["page", "pageSize", "sort", "q", "token", "id", "jobId"]);
  for (const m of Object.values(modules))
    for (const [name, v] of Object.entries(m)) {
      if (!/QuerySchema$/.test(name)) continue;
      if (v instanceof z.ZodObject) for (const k of Object.keys(v.shape)) keys.add(k);
    }
  return [...keys];
}

/** A query string: known keys with odd values, repeated keys, bracket syntax and broken percent-escapes. */
export const queryString = (keys: string[]) =>
  fc
    .array(
      fc.oneof(
        fc.tuple(fc.constantFrom(...keys), oddString).map(([k, v]) => `${k}=${enc(v)}`),
        fc.constantFrom(...keys).map((k) => `${k}=1&${k}=2`),
        fc.constantFrom(...keys).map((k) => `${k}[a][b]=1`),
        fc.constantFrom(...keys).map((k) => `${k}=%ZZ`),
        fc.constantFrom("%", "&&&", "=", "a=%E0%A4%A", "__proto__[x]=1"),
      ),
      { minLength: 1, maxLength: 5 },
    )
    .map((parts) => parts.join("&"));

/** What goes where a path parameter sits. Raw (already URL-safe or deliberately broken) segments. */
export const pathSegment = fc.oneof(
  fc.constantFrom("abc", "-1", "0", "1.5", "1e309", "99999999999999999999", "%00", "%E0%A4%A", "%ZZ", "0x10", " 1", "1%20", "null", "%2e%2e", "🎨", "1;DROP%20TABLE%20jobs"),
  fc.string({ unit: "binary", maxLength: 20 }).map(enc),
  fc.integer().map(String),
);

/** Headers a client might send wrongly. */
export const oddHeaders = fc.record(
  {
    "content-type": fc.constantFrom(
      "text/plain", "application/json; charset=utf-16", "application/json; charset=bogus", "multipart/form-data",
      "multipart/form-data; boundary=", "application/x-www-form-urlencoded", "application/octet-stream", "application/xml", "",
    ),
    "content-encoding": fc.constantFrom("gzip", "deflate", "br", "bogus", "identity"),
    cookie: fc.oneof(fc.constant("auth_session="), oddString.map((v) => `auth_session=${enc(v)}`), fc.constant("a=b; auth_session=x; auth_session=y")),
    accept: fc.constantFrom("*/*", "text/html", "application/xml", "", "application/json;q=0"),
    "x-portal-token": oddString.map(enc),
    range: fc.constantFrom("bytes=0-1", "bytes=999999999-", "bytes=abc", "items=0-1"),
    "if-none-match": fc.constantFrom("*", '"x"', "W/\"1\""),
  },
  { requiredKeys: [] },
);

/** A multipart part: random bytes or a truncated/relabelled real file, with an odd name and field values. */
export const oddFile = (realFile: Buffer) =>
  fc.record({
    data: fc.oneof(fc.uint8Array({ maxLength: 2000 }).map((a) => Buffer.from(a)), fc.nat({ max: realFile.length }).map((n) => realFile.subarray(0, n)), fc.constant(realFile)),
    filename: fc.oneof(fc.constantFrom("x.png", "../../x.png", "a.heic", "x", ".png", "x.exe", "😀.jpg", "a".repeat(300) + ".png"), fc.string({ minLength: 1, maxLength: 30 }).map((s) => s.replace(/[\r\n"\\/]/g, "_") || "f")),
    field: fc.constantFrom("file", "file", "photo", "files[]"),
    fields: fc.dictionary(fc.constantFrom("ownerType", "ownerId", "caption", "shareable", "kind", "jobId", "x"), oddString.map((v) => v.replace(/[\ud800-\udfff]/g, "").replaceAll("\0", "")), { maxKeys: 4 }),
  });
