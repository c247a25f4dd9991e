import { MAX_SCHEDULE_ROWS, ScheduleRequest } from "@/lib/contracts/schedule";
import { scheduleRowCount } from "@/lib/calc/schedule-rows";
import { calcResponse } from "@/lib/server/calc-pool";
import { endpoint, HttpError } from "@/lib/server/http";

/** Hour-by-hour sun, irradiance and transmitted solar energy for each surface of a site. */
export const POST = endpoint(
  {
    auth: "user",
    body: ScheduleRequest,
    // Room for a year of hourly weather values next to the surfaces.
    maxBytes: 2 * 1024 * 1024,
    engineErrorsField: "(body)",
  },
  ({ body }) => {
    const rows = scheduleRowCount(body, MAX_SCHEDULE_ROWS);
    if (rows > MAX_SCHEDULE_ROWS) {
      throw new HttpError(
        413,
        `This request asks for about ${rows.toLocaleString("en")} rows (surfaces × time steps); the limit is ${MAX_SCHEDULE_ROWS.toLocaleString("en")} per request. Ask for fewer surfaces, a shorter period or a longer step.`,
        { errors: [{ field: "surfaces", message: "too much work for one request" }] },
      );
    }
    // Computed in the worker pool (503 with Retry-After when its queue is full).
    return calcResponse("schedule", body);
  },
);
