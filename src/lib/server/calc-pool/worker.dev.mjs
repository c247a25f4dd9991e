// Worker entry when the app runs from its TypeScript sources (astro dev, vitest): compiles the
// worker on the fly with tsx (which reads tsconfig.json for the @/ alias). The build ships a
// bundled dist/server/calc-worker.mjs instead.
import { register } from "tsx/esm/api";

register({ tsconfig: new URL("../../../../tsconfig.json", import.meta.url).pathname });
await import("./worker.ts");
