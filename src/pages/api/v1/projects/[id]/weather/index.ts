import { WeatherCreatedResponse, WeatherResponse } from "@/lib/contracts/uploads";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, problem, jsonOf } from "@/lib/server/http";
import { readUploadedFile } from "@/lib/server/upload-body";
import { validateWeatherCsv } from "@/lib/server/uploads/weather-csv";
import { deleteWeather, saveWeather, weatherOf } from "@/lib/server/services/uploads";

const params = z.object({ id: rowId });

/** The project's weather series (period, hours, file and SHA-256), or `weather: null` when its results use clear sky. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project }) =>
  jsonOf(WeatherResponse, { weather: await weatherOf(project.id) }),
);

/**
 * An hourly weather series from a CSV file (multipart/form-data, field `file`) in place of the clear sky:
 * 201 { from, to, hours, sha256, weather }, or 400 listing every problem with its line and column (nothing saved).
 */
export const POST = endpoint({ auth: { project: "id", permission: "project:update" }, params }, async ({ project, user, request }) => {
  const file = await readUploadedFile(request, { fallbackName: "weather.csv" });
  const checked = validateWeatherCsv(file.bytes, project.timeZone);
  if (!checked.ok) {
    const n = checked.errors.length;
    return problem(
      400,
      `The file has ${n === 1 ? "a problem" : `${n} problems`}; nothing was saved. Fix ${n === 1 ? "it" : "them"} and upload it again.`,
      {
        errors: checked.errors as never,
      },
    );
  }
  const weather = await saveWeather(project, { id: user.id, name: user.name }, file, checked.weather);
  return jsonOf(WeatherCreatedResponse, { from: weather.from, to: weather.to, hours: weather.hours, sha256: weather.sha256, weather }, 201);
});

/** Removes the weather series: the results use the clear-sky model again. */
export const DELETE = endpoint({ auth: { project: "id", permission: "project:update" }, params }, async ({ project, user }) => {
  await deleteWeather(project, { id: user.id, name: user.name });
  return new Response(null, { status: 204 });
});
