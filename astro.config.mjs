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
 * The calculation worker runs in its own thread from a file of its own, which Vite's server bundle
 * does not contain: after the build, bundle it with esbuild into dist/server/calc-worker.mjs (next to
 * entry.mjs, where src/lib/server/calc-pool looks for it). Dev and tests run it from the sources.
 */
/** @type {import("astro").AstroIntegration} */
const calcWorker = {
  name: "paneray-calc-worker",
  hooks: {
    "astro:build:done": async ({ logger }) => {
      const outfile = fileURLToPath(new URL("./dist/server/calc-worker.mjs", import.meta.url));
      await esbuild({
        entryPoints: [fileURLToPath(new URL("./src/lib/server/calc-pool/worker.ts", import.meta.url))],
        outfile,
        bundle: true,
        platform: "node",
        format: "esm",
        target: "node20",
        tsconfig: fileURLToPath(new URL("./tsconfig.json", import.meta.url)),
        logLevel: "warning",
      });
      logger.info(`calculation worker bundled into ${outfile}`);
      // The job worker that scripts/server.mjs runs inside the web server (packages stay in node_modules).
      const jobs = fileURLToPath(new URL("./dist/server/jobs.mjs", import.meta.url));
      await esbuild({
        entryPoints: [fileURLToPath(new URL("./src/lib/server/jobs/main.ts", import.meta.url))],
        outfile: jobs,
        bundle: true,
        packages: "external",
        platform: "node",
        format: "esm",
        target: "node20",
        tsconfig: fileURLToPath(new URL("./tsconfig.json", import.meta.url)),
        logLevel: "warning",
      });
      logger.info(`job worker bundled into ${jobs}`);
      // The workbook export thread (src/lib/server/workbook-thread looks for it next to entry.mjs).
      const thread = fileURLToPath(new URL("./dist/server/workbook-thread.mjs", import.meta.url));
      await esbuild({
        entryPoints: [fileURLToPath(new URL("./src/lib/server/workbook-thread/thread.ts", import.meta.url))],
        outfile: thread,
        bundle: true,
        packages: "external",
        platform: "node",
        format: "esm",
        target: "node20",
        tsconfig: fileURLToPath(new URL("./tsconfig.json", import.meta.url)),
        logLevel: "warning",
      });
      logger.info(`workbook export thread bundled into ${thread}`);
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
