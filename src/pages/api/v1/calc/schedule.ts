import { estimatedScheduleRows, MAX_SCHEDULE_ROWS, ScheduleRequest } from "@/lib/contracts/schedule";
import { scheduleResponse } from "@/lib/calc/schedule-response";
import { endpoint, HttpError, json, readJson, requireUser } from "@/lib/server/http";

export const prerender = false;

/** Room for a year of hourly weather values next to the surfaces. */
const MAX_BODY_BYTES = 2 * 1024 * 1024;

/** Hour-by-hour sun, irradiance and transmitted solar energy for each surface of a site. */
export const POST = endpoint(async ({ request, locals }) => {
  requireUser(locals);
  const input = await readJson(request, ScheduleRequest, MAX_BODY_BYTES);
  const rows = estimatedScheduleRows(input);
  if (rows > MAX_SCHEDULE_ROWS) {
    throw new HttpError(
      413,
      `This request asks for about ${rows.toLocaleString("en")} rows (surfaces × time steps); the limit is ${MAX_SCHEDULE_ROWS.toLocaleString("en")} per request. Ask for fewer surfaces, a shorter period or a longer step.`,
      { errors: [{ field: "surfaces", message: "too much work for one request" }] },
    );
  }
  try {
    return json(scheduleResponse(input));
  } catch (err) {
    if (err instanceof RangeError) throw new HttpError(400, err.message, { errors: [{ field: "(body)", message: err.message }] });
    throw err;
  }
});
