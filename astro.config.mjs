// @ts-check
import { defineConfig } from "astro/config";
import node from "@astrojs/node";
import react from "@astrojs/react";
import tailwindcss from "@tailwindcss/vite";
import { setBaseHeaders } from "./scripts/security-headers.mjs";
import { build as esbuild } from "esbuild";
import { fileURLToPath } from "node:url";

/** The development server sets the same headers on every response as scripts/server.mjs does in production. */
const baseHeaders = {
  name: "paneray-base-headers",
  /** @param {import("vite").ViteDevServer} server */
  configureServer(server) {
    server.middlewares.use((_req, res, next) => {
      setBaseHeaders(res);
      next();
    });
  },
};

/**
 * Files that run in threads or beside the server, which Vite's server bundle does not contain: after the
 * build, each is bundled with esbuild into dist/server (next to entry.mjs, where the code that starts them
 * looks). Dev and tests run them from the sources.
 *   - calc-worker.mjs: the calculation pool's worker (src/lib/server/calc-pool), self-contained;
 *   - jobs.mjs: the job worker that scripts/server.mjs runs inside the web server;
 *   - workbook-thread.mjs: the workbook export thread (src/lib/server/workbook-thread).
 * The last two keep their packages in node_modules.
 */
const BUNDLES = [
  { entry: "./src/lib/server/calc-pool/worker.ts", out: "calc-worker.mjs", what: "calculation worker", external: false },
  { entry: "./src/lib/server/jobs/main.ts", out: "jobs.mjs", what: "job worker", external: true },
  { entry: "./src/lib/server/workbook-thread/thread.ts", out: "workbook-thread.mjs", what: "workbook export thread", external: true },
];

/** @type {import("astro").AstroIntegration} */
const calcWorker = {
  name: "paneray-calc-worker",
  hooks: {
    "astro:build:done": async ({ logger }) => {
      for (const b of BUNDLES) {
        const outfile = fileURLToPath(new URL(`./dist/server/${b.out}`, import.meta.url));
        await esbuild({
          entryPoints: [fileURLToPath(new URL(b.entry, import.meta.url))],
          outfile,
          bundle: true,
          ...(b.external ? { packages: "external" } : {}),
          platform: "node",
          format: "esm",
          target: "node20",
          tsconfig: fileURLToPath(new URL("./tsconfig.json", import.meta.url)),
          logLevel: "warning",
        });
        logger.info(`${b.what} bundled into ${outfile}`);
      }
    },
  },
};

/** Extra host names the server answers for (comma-separated), e.g. a production domain. */
const extraHosts = (process.env.PANERAY_HOSTS ?? "")
  .split(",")
  .map((h) => h.trim())
  .filter(Boolean)
  .map((hostname) => ({ hostname }));

export default defineConfig({
  output: "server",
  // "middleware": the built handler only renders; scripts/server.mjs is the HTTP server (headers, static files).
  adapter: node({ mode: "middleware" }),
  integrations: [react(), calcWorker],
  security: {
    // src/middleware.ts refuses cross-site form-like writes itself (lib/server/cross-origin.ts formWriteRefusal),
    // so that scripts calling /api/v1 with an API key and no cookie need no Origin header.
    checkOrigin: false,
    // Without this the node adapter distrusts the Host header: request.url becomes
    // http://localhost/… and same-origin form posts are refused.
    allowedDomains: [{ hostname: "127.0.0.1" }, { hostname: "localhost" }, ...extraHosts],
  },
  vite: {
    plugins: [tailwindcss(), baseHeaders],
    // Small assets (font subsets) stay files instead of data: URLs, so the policy needs no data: source.
    build: { assetsInlineLimit: 0 },
  },
  experimental: {
    // Content-Security-Policy header on every rendered page: scripts and styles only from our origin,
    // plus the sha256 hashes of the inline scripts and styles Astro itself emits (island hydration).
    csp: {
      algorithm: "SHA-256",
      directives: ["default-src 'self'", "object-src 'none'", "base-uri 'self'", "form-action 'self'", "frame-ancestors 'none'"],
    },
  },
});
