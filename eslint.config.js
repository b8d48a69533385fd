// ESLint flat config: the TypeScript and React hooks rules, and the project's boundaries (see DEVELOPERS.md).
import { readdirSync } from "node:fs";
import js from "@eslint/js";
import globals from "globals";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

/**
 * The only imports allowed from one client feature into another: each is a component or query that belongs to
 * the feature it comes from and is shown inside another's screen. Add one here with its reason, or move the
 * code to src/components or src/lib when several features share it.
 */
const CROSS_FEATURE = {
  booth: ["uploads"], // the booth card's photo button
  "finish-record": ["customers", "jobs", "plans"], // the repeat dialog picks a customer; a repeat refreshes jobs and plans
  intake: ["quotes"], // adding the inspection's prep line refreshes the job's quotes
  panels: ["guns", "materials", "plans"], // the panel form picks a gun, a ground and a plan layer
  plans: ["materials"], // mix sheets read the catalogue
  portal: ["jobs", "panels"], // the customer's job card shows the stage and the approved panel
  quotes: ["payments"], // the quote's payments panel
};

const FEATURES = readdirSync(new URL("./src/features", import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

/** Import patterns that reach a folder at the top of the repository, whether by alias or by a relative path. */
const topFolder = (name) => [`**/${name}`, `**/${name}/**`];

const restrict = (...groups) => ({ "no-restricted-imports": ["error", { patterns: groups }] });

const NOT_SERVER = { group: topFolder("server"), message: "The client never imports server code; share it through shared/." };
const NOT_SRC = { group: [...topFolder("src"), "@/*", "@/**"], message: "Server and shared code never import the client (src/)." };
const NOT_APP = { group: ["@/app", "@/app/**", "**/app/routes/**", "**/app/providers/**"], message: "A feature does not import from src/app: the app composes features, not the other way round." };

/**
 * In a feature, every other feature is off limits except those declared in CROSS_FEATURE: by alias, and by a relative
 * path climbing exactly to src/features from the file's depth in its feature (so a sub-folder that happens to share a
 * feature's name is not caught).
 */
const featureBoundaries = FEATURES.flatMap((feature) => {
  const allowed = new Set([feature, ...(CROSS_FEATURE[feature] ?? [])]);
  const others = FEATURES.filter((f) => !allowed.has(f));
  return [0, 1, 2, 3, 4, 5].map((depth) => {
    const up = "../".repeat(depth + 1);
    return {
      files: [`src/features/${feature}/${"*/".repeat(depth)}*.{ts,tsx}`],
      rules: restrict(NOT_SERVER, NOT_APP, {
        group: others.flatMap((f) => [`@/features/${f}`, `@/features/${f}/**`, `${up}${f}`, `${up}${f}/**`]),
        message: `A feature imports another feature only where eslint.config.js declares it (CROSS_FEATURE.${feature}).`,
      }),
    };
  });
});

export default tseslint.config(
  { ignores: ["dist/**", "node_modules/**", "data/**", "drizzle/**", "tests/.artefacts/**", "coverage/**", "**/*.tmp.*"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { ecmaVersion: 2023, sourceType: "module", globals: { ...globals.node, ...globals.browser } },
    linterOptions: { reportUnusedDisableDirectives: "error" },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none", ignoreRestSiblings: true }],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    // The rules of hooks and complete effect dependencies. The plugin's React Compiler rules are left out: the app
    // is not compiled with the React Compiler.
    rules: { "react-hooks/rules-of-hooks": "error", "react-hooks/exhaustive-deps": "error" },
  },
  { files: ["src/**/*.{ts,tsx}"], rules: restrict(NOT_SERVER) },
  { files: ["server/**/*.ts"], rules: restrict(NOT_SRC) },
  { files: ["shared/**/*.ts"], rules: restrict(NOT_SRC, { group: topFolder("server"), message: "shared/ is used by client and server alike: it imports neither." }) },
  ...featureBoundaries,
);
