import { GlazingRequest } from "@/lib/contracts/glazing";
import { calcResponse } from "@/lib/server/calc-pool";
import { endpoint } from "@/lib/server/http";

/** Solar optics at each angle, hemispherical values, g-values and the U-value of a make-up. */
export const POST = endpoint(
  {
    auth: "user",
    body: GlazingRequest,
    // A 6-pane make-up with 181 angles is under 4 KiB.
    maxBytes: 64 * 1024,
    // The physics core refuses combinations the schema cannot see (e.g. measured values no pane can have).
    engineErrorsField: "layers",
  },
  // Computed in the worker pool (503 with Retry-After when its queue is full).
  ({ body }) => calcResponse("glazing", body),
);
