// Thread entry when the app runs from its TypeScript sources (astro dev, vitest): compiles the thread on the
// fly with tsx (which reads tsconfig.json for the @/ alias). The build ships dist/server/workbook-thread.mjs.
import { register } from "tsx/esm/api";

register({ tsconfig: new URL("../../../../tsconfig.json", import.meta.url).pathname });
await import("./thread.ts");
