// Node flags for the server and the job worker (scripts/server-node-flags, one place for every launcher:
// npm start, npm run worker, the browser tests' web server, the fault tests and the benches). Empty by
// default: the workbook export, the one heavy allocator, bounds its own heap on a thread of its own
// (src/lib/server/workbook-thread), which a process-wide cap would do at the cost of every request's speed.
import { readFileSync } from "node:fs";

export const SERVER_NODE_FLAGS = readFileSync(new URL("./server-node-flags", import.meta.url), "utf8")
  .trim()
  .split(/\s+/)
  .filter(Boolean);
