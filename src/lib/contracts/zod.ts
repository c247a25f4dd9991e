/**
 * zod for the contracts and the islands. In the browser zod runs without its compiled fast path
 * (jitless): probing for it calls `new Function`, which the pages' Content-Security-Policy forbids
 * and reports as a violation. The server keeps the fast path. Import `z` from here in code that
 * runs in the browser, so that the setting is made before the first schema is built.
 */
import { z } from "zod";

if (typeof document !== "undefined") z.config({ jitless: true });

export { z };
