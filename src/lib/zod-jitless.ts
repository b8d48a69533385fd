import { config } from "zod/v4/core";

/**
 * What `import … from "zod"` gives in the browser build (vite.config.ts aliases "zod" here): zod itself, switched
 * to jitless mode before any schema is made.
 *
 * Zod compiles faster object parsers with `new Function` when it can, and probes for that the first time an object
 * schema is made. The app's Content-Security-Policy (script-src 'self', no 'unsafe-eval') refuses it: zod catches
 * the error, but the browser still reports a CSP violation on every page. Jitless mode skips the probe and the
 * compiler; parsing gives the same results. An import in main.tsx would not do: the chunks a module imports run
 * before it, so schemas in shared chunks would be made first. As the module every zod import goes through, this
 * one runs before all of them.
 */
config({ jitless: true });

export * from "zod/v4";
