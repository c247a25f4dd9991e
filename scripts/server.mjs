/**
 * The production server: a Node.js HTTP server of ours that sets the headers every response carries
 * (scripts/security-headers.mjs), serves the built static files (dist/client) and hands everything else
 * to Astro's built handler (the adapter in "middleware" mode). Astro's own middleware never sees requests
 * for static files, so this is the one place that reaches all of them.
 *
 * The static files are listed once at start (they do not change after a build), so a page or API request
 * costs no file-system lookup: the adapter's own standalone server looks each request's path up on disk
 * twice before rendering, about a twentieth of the CPU time of a project-list request.
 *
 * Answers are compressed (gzip or Brotli, as the client accepts) when their type is text-like and they are larger
 * than 1 KiB: the reference pages (/docs/api, /validation) are about a megabyte of HTML each, a twentieth of that
 * compressed. Workbooks (.xlsx, already zip) and other binary types go out as they are.
 *
 * It also runs the job worker (e-mail deliveries, dist/server/jobs.mjs) in this process unless WORKER=off; then
 * `npm run worker` runs it elsewhere. The worker never ends the process: while the database is away it retries.
 *
 *   node scripts/server.mjs        (after `astro build`; HOST and PORT as for the adapter, default 127.0.0.1:4321)
 */
import { readdirSync, readFileSync } from "node:fs";
import http from "node:http";
import https from "node:https";
import { fileURLToPath } from "node:url";
import compression from "compression";
import send from "send";
import { setBaseHeaders } from "./security-headers.mjs";

const { handler } = await import(new URL("../dist/server/entry.mjs", import.meta.url).href);

const CLIENT_DIR = fileURLToPath(new URL("../dist/client/", import.meta.url));
/** URL paths of the built static files, e.g. "/_astro/client.DfokBjuf.js", "/favicon.svg". */
const STATIC_FILES = new Set(
  readdirSync(CLIENT_DIR, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => `/${e.parentPath.slice(CLIENT_DIR.length)}/${e.name}`.replace(/\/\/+/g, "/")),
);
/** Hashed build assets never change under their name. */
const IMMUTABLE_PREFIX = "/_astro/";

/** Serves a built static file for GET/HEAD of a listed path; false when the request is not one. */
function serveStatic(req, res) {
  if (req.method !== "GET" && req.method !== "HEAD") return false;
  const raw = (req.url ?? "/").split(/[?#]/, 1)[0];
  let path;
  try {
    path = decodeURIComponent(raw);
  } catch {
    return false;
  }
  if (!STATIC_FILES.has(path)) return false;
  send(req, path, { root: CLIENT_DIR, dotfiles: "deny", index: false })
    .on("headers", (r) => {
      if (path.startsWith(IMMUTABLE_PREFIX)) r.setHeader("Cache-Control", "public, max-age=31536000, immutable");
    })
    .on("error", (err) => {
      res.statusCode = err.status ?? 500;
      res.end();
    })
    .pipe(res);
  return true;
}

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 4321);

const compress = compression({ threshold: 1024 });

const listener = (req, res) => {
  setBaseHeaders(res);
  compress(req, res, () => route(req, res));
};

const route = (req, res) => {
  try {
    decodeURI(req.url ?? "/");
  } catch {
    res.writeHead(400);
    res.end("Bad request.");
    return;
  }
  if (!serveStatic(req, res)) handler(req, res);
};
// TLS as with the adapter's own server: SERVER_CERT_PATH and SERVER_KEY_PATH (PEM files).
const tls = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH;
const server = tls
  ? https.createServer({ cert: readFileSync(process.env.SERVER_CERT_PATH), key: readFileSync(process.env.SERVER_KEY_PATH) }, listener)
  : http.createServer(listener);

server.on("error", (err) => {
  console.error(`[server] ${err.message}`);
  process.exit(1);
});
server.listen(port, host, () => {
  const address = server.address();
  const shown =
    typeof address === "object" && address
      ? `${address.family === "IPv6" ? `[${address.address}]` : address.address}:${address.port}`
      : String(address);
  console.log(`[server] listening on ${tls ? "https" : "http"}://${shown}`);
});

/** The job worker of this process, when it runs one. */
const jobs = process.env.WORKER === "off" ? null : await import(new URL("../dist/server/jobs.mjs", import.meta.url).href);
jobs?.startWorker();

const stop = () => {
  let open = 2;
  const done = () => --open === 0 && process.exit(0);
  server.close(done);
  server.closeAllConnections();
  // The job in hand finishes (or is handed back to the queue) before the process ends.
  if (jobs) jobs.stopWorker(4000).then(done, (err) => (console.error(`[jobs] ${err.message}`), done()));
  else done();
  setTimeout(() => process.exit(0), 5000).unref();
};
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
