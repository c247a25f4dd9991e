import { GlazingRequest } from "@/lib/contracts/glazing";
import { calculateGlazing } from "@/lib/calc/glazing";
import { endpoint, HttpError, json, readJson, requireUser } from "@/lib/server/http";

export const prerender = false;

/** Bodies larger than this are refused with 413 (a 6-pane make-up with 181 angles is under 4 KiB). */
const MAX_BODY_BYTES = 64 * 1024;

/** Solar optics at each angle, hemispherical values, g-values and the U-value of a make-up. */
export const POST = endpoint(async ({ request, locals }) => {
  requireUser(locals);
  const input = await readJson(request, GlazingRequest, MAX_BODY_BYTES);
  try {
    return json(calculateGlazing(input));
  } catch (err) {
    // The physics core refuses combinations the schema cannot see (e.g. measured values no pane can have).
    if (err instanceof RangeError) throw new HttpError(400, err.message, { errors: [{ field: "layers", message: err.message }] });
    throw err;
  }
});
