// @ts-check
/**
 * ESLint (flat config). Rules check correctness and the import boundaries between layers;
 * formatting is Prettier's job, so every stylistic rule is switched off by eslint-config-prettier.
 *
 * Import boundaries (no-restricted-imports, regex patterns matched against the import string):
 * - src/lib/physics/**          imports only itself, complex.js and suncalc
 * - src/lib/calc/**             imports only itself, physics, time and contracts
 * - src/lib/time/**             imports only itself
 * - src/lib/reference-cases/**  imports only itself (pure data)
 * - src/lib/validation/**       imports only itself, physics, time, reference-cases, astronomy-engine and suncalc
 * - scripts/reference/**        never imports src/lib/physics or src/lib/calc (independent check values)
 * - src/components/**, src/lib/client/**  never import src/lib/server/**
 * - src/lib/server/services/**  never imports an http module (src/lib/server/http, node:http, …)
 * - everywhere: no import path climbs two folders up (`../../`); use the `@/` alias for src
 * - src/** except src/lib/server/env.ts: no process.env
 *
 * A relative path is matched as written, not resolved. Within a bounded folder "./x" always stays
 * inside; "../x" stays inside only from a sub-folder, so its top-level files may not use "../" at all
 * (they reach a neighbour through "@/lib/…", which the patterns see), and "../../" is banned everywhere.
 * ESLint does not merge the options of one rule from several config objects (the last one wins), so
 * every zone below repeats the rules that apply to all files (see `restrictImports`).
 */
import js from "@eslint/js";
import { defineConfig, globalIgnores } from "eslint/config";
import prettier from "eslint-config-prettier";
import astro from "eslint-plugin-astro";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

const SOURCE = "**/*.{js,mjs,cjs,ts,mts,cts,tsx,astro}";

/** Escapes a string for use inside a regular expression. @param {string} s */
const esc = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** Matches an `@/` alias path into one of the given src folders, e.g. "lib/physics". @param {string[]} folders */
const alias = (...folders) => folders.map((f) => `@/${esc(f)}(?:/|$)`);
/** Matches an npm package by name, with or without a sub-path. @param {string[]} names */
const pkg = (...names) => names.map((n) => `${esc(n)}(?:/|$)`);

/**
 * A pattern that reports every import not starting with one of the allowed prefixes.
 * @param {string[]} allowed regular expressions, each matching an allowed start of the import string
 * @param {string} message
 */
const onlyAllow = (allowed, message) => ({ regex: `^(?!(?:${allowed.join("|")}))`, caseSensitive: true, message });

const SAME_FOLDER = ["\\./", "\\.$"];
const PARENT_FOLDER = ["\\.\\./", "\\.\\.$"];

/** Rules every file gets. */
const COMMON_PATTERNS = [
  {
    regex: "(?:^|/)\\.\\./\\.\\.(?:/|$)",
    caseSensitive: true,
    message: 'Do not climb two folders up; import through the @/ alias ("@/lib/physics/fresnel").',
  },
];
/** Rules every file under src/ gets. */
const SRC_PATHS = ["process", "node:process"].map((name) => ({
  name,
  importNames: ["env"],
  message: "Read configuration through src/lib/server/env.ts, not process.env.",
}));

/**
 * no-restricted-imports with the common rules plus the given ones.
 * @param {{ patterns?: object[], paths?: object[] }} restrictions
 * @returns {import("eslint").Linter.RuleEntry}
 */
const restrictImports = ({ patterns = [], paths = [] }) => ["error", { patterns: [...COMMON_PATTERNS, ...patterns], paths: [...paths] }];

/**
 * Config objects for a folder whose files may import only the given prefixes: its top-level files may
 * not use "../" (that leaves the folder), files in its sub-folders may.
 * @param {string} folder
 * @param {string[]} allowed see onlyAllow
 * @param {string} message
 * @returns {import("eslint").Linter.Config[]}
 */
function pureFolder(folder, allowed, message) {
  /** @type {import("eslint").Linter.RuleEntry} */
  const noDynamicImport = [
    "error",
    {
      selector: "ImportExpression",
      message: `${folder} is pure: no dynamic import().`,
    },
  ];
  return [
    {
      name: `paneray/boundary/${folder}`,
      files: [`${folder}/*`],
      rules: {
        "no-restricted-imports": restrictImports({
          paths: SRC_PATHS,
          patterns: [onlyAllow([...SAME_FOLDER, ...allowed], message)],
        }),
        "no-restricted-syntax": noDynamicImport,
      },
    },
    {
      name: `paneray/boundary/${folder}/sub-folders`,
      files: [`${folder}/*/**`],
      rules: {
        "no-restricted-imports": restrictImports({
          paths: SRC_PATHS,
          patterns: [onlyAllow([...SAME_FOLDER, ...PARENT_FOLDER, ...allowed], message)],
        }),
        "no-restricted-syntax": noDynamicImport,
      },
    },
  ];
}

const NO_SERVER_IN_BROWSER = {
  regex: "(?:^|/)lib/server(?:/|$)|^\\.\\./server(?:/|$)",
  caseSensitive: true,
  message: "Islands and browser code never import src/lib/server/**; go through src/lib/client/api.ts and the contracts.",
};

export default defineConfig([
  globalIgnores([
    "dist/",
    "node_modules/",
    ".astro/",
    ".data/",
    "drizzle/meta/",
    "test-results/",
    "playwright-report/",
    "src/lib/server/db/auth-schema.ts",
  ]),

  js.configs.recommended,
  tseslint.configs.recommended,
  astro.configs["flat/recommended"],

  {
    name: "paneray/globals",
    files: [SOURCE],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    name: "paneray/globals/browser",
    files: ["src/components/**", "src/lib/client/**"],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    name: "paneray/react-hooks",
    files: ["src/**/*.{ts,tsx}"],
    extends: [reactHooks.configs.flat.recommended],
    // a missing dependency is a stale-closure bug: fail on it rather than warn
    rules: { "react-hooks/exhaustive-deps": "error" },
  },
  {
    name: "paneray/typescript",
    rules: {
      // `_`-prefixed names mark deliberately unused parameters and destructured leftovers.
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrorsIgnorePattern: "^_", ignoreRestSiblings: true },
      ],
    },
  },

  // ---- import boundaries (later objects win per rule; zones are disjoint) ----
  {
    name: "paneray/boundary/all",
    files: [SOURCE],
    rules: { "no-restricted-imports": restrictImports({}) },
  },
  {
    name: "paneray/boundary/src",
    files: ["src/**"],
    ignores: ["src/lib/server/env.ts"],
    rules: {
      "no-restricted-imports": restrictImports({ paths: SRC_PATHS }),
      "no-restricted-properties": [
        "error",
        { object: "process", property: "env", message: "Read configuration through src/lib/server/env.ts, not process.env." },
      ],
    },
  },
  ...pureFolder(
    "src/lib/physics",
    [...alias("lib/physics"), ...pkg("complex.js", "suncalc")],
    "The physics core imports only src/lib/physics/**, complex.js and suncalc.",
  ),
  ...pureFolder(
    "src/lib/calc",
    alias("lib/calc", "lib/physics", "lib/time", "lib/contracts"),
    "src/lib/calc imports only itself, src/lib/physics, src/lib/time and src/lib/contracts (through @/).",
  ),
  ...pureFolder("src/lib/time", alias("lib/time"), "src/lib/time imports only itself."),
  ...pureFolder("src/lib/reference-cases", alias("lib/reference-cases"), "src/lib/reference-cases is pure data and imports only itself."),
  ...pureFolder(
    "src/lib/validation",
    [...alias("lib/validation", "lib/physics", "lib/time", "lib/reference-cases"), ...pkg("astronomy-engine", "suncalc")],
    "src/lib/validation imports only itself, src/lib/physics, src/lib/time, src/lib/reference-cases and the reference libraries astronomy-engine and suncalc.",
  ),
  {
    name: "paneray/boundary/scripts/reference",
    files: ["scripts/reference/**"],
    rules: {
      "no-restricted-imports": restrictImports({
        patterns: [
          {
            regex: "(?:^|/)lib/(?:physics|calc)(?:/|$)",
            caseSensitive: true,
            message:
              "Reference scripts compute check values independently of the engine: no src/lib/physics or src/lib/calc (src/lib/reference-cases and npm packages are fine).",
          },
        ],
      }),
    },
  },
  {
    name: "paneray/boundary/browser",
    files: ["src/components/**", "src/lib/client/**"],
    rules: {
      "no-restricted-imports": restrictImports({ paths: SRC_PATHS, patterns: [NO_SERVER_IN_BROWSER] }),
      "no-restricted-syntax": [
        "error",
        {
          selector: "ImportExpression[source.value=/(^|\\/)lib\\/server(\\/|$)|^\\.\\.\\/server(\\/|$)/]",
          message: NO_SERVER_IN_BROWSER.message,
        },
      ],
    },
  },
  {
    name: "paneray/boundary/services",
    files: ["src/lib/server/services/**"],
    rules: {
      "no-restricted-imports": restrictImports({
        paths: SRC_PATHS,
        patterns: [
          {
            regex: "(?:^|/|:)https?(?:/|$)",
            caseSensitive: true,
            message: "Services know nothing of HTTP: throw a domain error and let the endpoint map it (no src/lib/server/http, node:http).",
          },
        ],
      }),
    },
  },

  prettier,
]);
