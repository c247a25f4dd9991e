// The node flags the server and the job worker run with (scripts/server-node-flags, one place for every
// launcher: npm start, the browser tests' web server, the fault tests and the benches). A bounded old space
// keeps V8 collecting as it goes instead of growing towards the machine's memory: a full-year workbook export
// then peaks near 230 MB RSS instead of 320–360 MB (npm run bench -- workbook), with the same speed.
import { readFileSync } from "node:fs";

export const SERVER_NODE_FLAGS = readFileSync(new URL("./server-node-flags", import.meta.url), "utf8")
  .trim()
  .split(/\s+/)
  .filter(Boolean);
