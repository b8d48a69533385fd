import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { describe, expect, it } from "vitest";
import { makeApp } from "../../support/test-app";

/**
 * Security headers from helmet on every kind of answer (the app shell, API reads, API errors), with a
 * Content-Security-Policy the built app can run under: only its own scripts, no inline script, no eval, no
 * framing. (Cookie flags, sign-out, password change and argon2id parameters: tests/api/auth.test.ts. The
 * browser tests load every screen under this policy and fail on any violation.)
 */
function appWithShell() {
  const clientDir = mkdtempSync(path.join(tmpdir(), "cw-shell-"));
  writeFileSync(path.join(clientDir, "index.html"), '<!doctype html><div id="root"></div><script type="module" src="/assets/index.js"></script>');
  return makeApp({ clientDir });
}

/** CSP header → { directive: [values] }. */
const directives = (csp: string) =>
  Object.fromEntries(
    csp
      .split(";")
      .map((d) => d.trim().split(/\s+/))
      .filter((d) => d[0])
      .map(([name, ...values]) => [name!, values]),
  );

describe("security headers", () => {
  const t = appWithShell();
  const answers = [
    ["the app shell", () => request(t.app).get("/jobs/12")],
    ["an API read", () => request(t.app).get("/api/health")],
    ["an API refusal", () => request(t.app).get("/api/jobs")],
    ["an unknown API path", () => request(t.app).get("/api/nowhere")],
    ["a bad body", () => request(t.app).post("/api/auth/sign-in").set("Content-Type", "application/json").send("{")],
  ] as const;

  it.each(answers)("%s carries helmet's headers and no framework banner", async (_what, call) => {
    const res = await call();
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["referrer-policy"]).toBe("no-referrer");
    expect(res.headers["strict-transport-security"]).toMatch(/max-age=\d{7,}/);
    expect(res.headers["cross-origin-opener-policy"]).toBe("same-origin");
    expect(res.headers["cross-origin-resource-policy"]).toBe("same-origin");
    expect(res.headers["x-frame-options"]).toBe("SAMEORIGIN");
    expect(res.headers["x-powered-by"]).toBeUndefined();
    expect(res.headers["content-security-policy"]).toBeTruthy();
  });

  it.each(answers.filter(([what]) => what !== "the app shell"))("%s is never stored by the browser or a proxy (private records)", async (_what, call) => {
    const res = await call();
    expect(res.headers["cache-control"]).toBe("no-store");
    expect(res.headers.etag).toBeUndefined();
  });

  it("the app shell may be cached but is checked each time, so a new build is picked up", async () => {
    const res = await answers[0][1]();
    expect(res.headers["cache-control"]).toBe("public, max-age=0");
  });

  it("the Content-Security-Policy allows only the app's own scripts, no inline script or eval, no plugins, no framing", async () => {
    const res = await request(t.app).get("/");
    expect(res.status).toBe(200);
    const d = directives(res.headers["content-security-policy"]!);
    expect(d["default-src"]).toEqual(["'self'"]);
    expect(d["script-src"]).toEqual(["'self'"]);
    expect(d["script-src-attr"]).toEqual(["'none'"]);
    expect(d["object-src"]).toEqual(["'none'"]);
    expect(d["frame-ancestors"]).toEqual(["'none'"]);
    expect(d["base-uri"]).toEqual(["'self'"]);
    expect(d["form-action"]).toEqual(["'self'"]);
    expect(d["connect-src"]).toEqual(["'self'"]);
    // Photos are shown from blob: previews and data: thumbnails; nothing is loaded from another origin.
    expect(d["img-src"]).toEqual(["'self'", "data:", "blob:"]);
    for (const [name, values] of Object.entries(d)) expect({ name, wildcard: values.some((v) => v === "*" || v === "https:" || v === "http:") }).toEqual({ name, wildcard: false });
  });

  it("the page the browser loads has no inline script, so script-src 'self' is enough for it to run", () => {
    const html = readFileSync(path.resolve(import.meta.dirname, "../../../index.html"), "utf8");
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc="\//);
      expect(body!.trim()).toBe("");
    }
    expect(html).not.toMatch(/\son[a-z]+="/i); // no inline event handlers (script-src-attr 'none')
  });
});
