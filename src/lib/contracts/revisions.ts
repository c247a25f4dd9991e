/** Requests of the results and revision routes: the results year and the issue form. */
import { z } from "./zod";
import { optionalText } from "./common";

export const MIN_RESULTS_YEAR = 1901;
export const MAX_RESULTS_YEAR = 2099;

/** A calendar year of hourly results. */
const YEAR_MESSAGE = `Year must be a whole number between ${MIN_RESULTS_YEAR} and ${MAX_RESULTS_YEAR}`;
const year = () => z.number({ error: YEAR_MESSAGE }).int(YEAR_MESSAGE).min(MIN_RESULTS_YEAR, YEAR_MESSAGE).max(MAX_RESULTS_YEAR, YEAR_MESSAGE);

/** A year in a query string (text). */
export const ResultsYear = z.coerce
  .number({ error: `Year must be a whole number between ${MIN_RESULTS_YEAR} and ${MAX_RESULTS_YEAR}` })
  .int(`Year must be a whole number between ${MIN_RESULTS_YEAR} and ${MAX_RESULTS_YEAR}`)
  .min(MIN_RESULTS_YEAR, `Year must be a whole number between ${MIN_RESULTS_YEAR} and ${MAX_RESULTS_YEAR}`)
  .max(MAX_RESULTS_YEAR, `Year must be a whole number between ${MIN_RESULTS_YEAR} and ${MAX_RESULTS_YEAR}`);

/** GET /projects/:id/results?year=YYYY (default: the current year). */
export const ResultsQuery = z.object({ year: ResultsYear.optional() });

/** POST /projects/:id/revisions: an optional note; the results year defaults to the current year. */
export const RevisionIssueRequest = z
  .object({
    note: optionalText("Note", 2000, { multiline: true }),
    year: year().optional(),
  })
  .strict();
export type RevisionIssueRequest = z.infer<typeof RevisionIssueRequest>;

/** GET /projects/:id/compare?options=a,b[,…]&year=YYYY */
export const MAX_COMPARED_OPTIONS = 6;

/** A revision letter in a URL: A … Z, AA, AB … */
export const RevisionLetter = z.string().regex(/^[A-Z]{1,4}$/, "not a revision letter");

/** The letter of the n-th revision (1 → A, 26 → Z, 27 → AA, 28 → AB, 702 → ZZ, 703 → AAA). */
export function revisionLetter(sequence: number): string {
  if (!Number.isInteger(sequence) || sequence < 1) throw new RangeError("revision sequence must be a whole number ≥ 1");
  let n = sequence;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

/** GET /projects/:id/compare: two or more option ids, comma-separated, and the year. */
export const CompareQuery = z.object({
  options: z
    .string({ error: "Options to compare are required (options=id,id)" })
    .transform((s) => [
      ...new Set(
        s
          .split(",")
          .map((x) => x.trim())
          .filter(Boolean),
      ),
    ])
    .pipe(
      z
        .array(z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, "Options to compare must be option ids"))
        .min(2, "Choose at least two options to compare")
        .max(MAX_COMPARED_OPTIONS, `Compare at most ${MAX_COMPARED_OPTIONS} options at once`),
    ),
  year: ResultsYear.optional(),
});

/** Angles of incidence of the comparison's angular curves, degrees. */
export const COMPARE_ANGLES_DEG = Array.from({ length: 19 }, (_, i) => i * 5);
