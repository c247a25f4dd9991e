/**
 * Check values for local timelines: the rows of a local date range in an IANA time zone, with daylight saving.
 *
 * A row is one step of local time evaluated at its midpoint (common practice, no source): 00:30, 01:30, … for
 * hourly rows. Inputs: zone name, first and last local date (YYYY-MM-DD), step in minutes.
 *
 * Besides numeric expected values (row counts, offsets, local hours), a case lists rows by index with their
 * ISO 8601 local time and offset (`expectedIso`), the UTC instant at which the row's interval starts
 * (`expectedIntervalStartUtc`) or at which it is evaluated (`expectedEpochUtc`); all follow from the zone's rules.
 */
import type { CaseSource, ExpectedValue, ReferenceCase, ReferenceDomain } from "./types";

export interface LocalTimelineInput {
  readonly timeZone: string;
  readonly from: string;
  readonly to: string;
  readonly stepMinutes: number;
  /** The rule day of the change: the n-th Sunday of a month (−1 = last), or the first Sunday on or after a day. */
  readonly ruleDay?:
    | { readonly year: number; readonly month: number; readonly nthSunday: number }
    | { readonly year: number; readonly month: number; readonly sundayOnOrAfter: number };
}

export interface LocalTimelineCase extends ReferenceCase<LocalTimelineInput> {
  /** Row index → ISO 8601 local time with offset, e.g. "2026-03-29T02:30:00+01:00". */
  readonly expectedIso?: Readonly<Record<number, string>>;
  /** Row index → UTC instant at which the row's interval starts. */
  readonly expectedIntervalStartUtc?: Readonly<Record<number, string>>;
  /** Row index → UTC instant at which the row is evaluated (the interval midpoint). */
  readonly expectedEpochUtc?: Readonly<Record<number, string>>;
}

const tzRules = (rules: string): CaseSource => ({
  kind: "published",
  citation: `IANA Time Zone Database (tzdata), ${rules} (rules quoted from memory)`,
  fromMemory: true,
});
const eu = tzRules(
  "EU rules (Europe/Lisbon, Europe/Paris): summer time from the last Sunday of March to the last Sunday of October, both changes at 01:00 UTC",
);
const us = tzRules("US rules (America/New_York): daylight time from the second Sunday of March to the first Sunday of November, at 02:00 local time");
const au = tzRules(
  "Australian NSW and South Australia rules (Australia/Sydney, Australia/Adelaide): daylight time ends on the first Sunday of April at " +
    "03:00 daylight time (clocks back to 02:00) and starts on the first Sunday of October at 02:00 standard time (clocks to 03:00)",
);
const chile = tzRules(
  "Chile rules (America/Santiago): −03 → −04 on the first Sunday on or after 2 April at 03:00 UTC, −04 → −03 on the first Sunday on or after " +
    "2 September at 04:00 UTC, i.e. at local midnight",
);
const lordHowe = tzRules("Australia/Lord_Howe: a 30-minute daylight-saving shift on the NSW Sundays");
const fixed = tzRules("fixed offsets Asia/Kolkata +05:30 and Asia/Kathmandu +05:45; Africa/Monrovia −00:44:30 (local mean time) until 1972");

const exact = { abs: 0, reason: "an integer count, or minutes and hours exact in float64" } as const;
const rows = (n: number): ExpectedValue => ({ quantity: "rows", unit: "-", value: n, tolerance: exact });
const at = (
  quantity: "offsetMinutes" | "localHour" | "dayRowCount" | "dayFirstRow" | "ruleDayOfMonth",
  index: number | null,
  value: number,
): ExpectedValue => ({
  quantity: index === null ? quantity : `${quantity}[${index}]`,
  unit: quantity === "offsetMinutes" ? "min" : quantity === "localHour" ? "h" : "-",
  value,
  tolerance: exact,
});
const oneDay = (timeZone: string, date: string, stepMinutes = 60) => ({ timeZone, from: date, to: date, stepMinutes });

const cases: readonly LocalTimelineCase[] = [
  {
    id: "local-timeline/europe-lisbon/2026-03-29",
    label: "Europe/Lisbon 2026-03-29 (last Sunday of March): 23 rows, 01:00 UTC jumps to 02:00 WEST",
    input: { ...oneDay("Europe/Lisbon", "2026-03-29"), ruleDay: { year: 2026, month: 3, nthSunday: -1 } },
    expected: [
      at("ruleDayOfMonth", null, 29),
      rows(23),
      at("offsetMinutes", 0, 0),
      at("offsetMinutes", 1, 60),
      at("offsetMinutes", 2, 60),
      at("localHour", 0, 0.5),
      at("localHour", 1, 2.5),
      at("localHour", 2, 3.5),
      at("localHour", 22, 23.5),
    ],
    expectedIso: { 0: "2026-03-29T00:30:00+00:00", 1: "2026-03-29T02:30:00+01:00", 2: "2026-03-29T03:30:00+01:00", 22: "2026-03-29T23:30:00+01:00" },
    // row 1 starts at the change instant, 01:00 UTC
    expectedIntervalStartUtc: { 0: "2026-03-29T00:00:00Z", 1: "2026-03-29T01:00:00Z" },
    source: eu,
  },
  {
    id: "local-timeline/europe-lisbon/2026-10-25",
    label: "Europe/Lisbon 2026-10-25 (last Sunday of October): 25 rows, 01:00–02:00 local twice",
    input: { ...oneDay("Europe/Lisbon", "2026-10-25"), ruleDay: { year: 2026, month: 10, nthSunday: -1 } },
    expected: [
      at("ruleDayOfMonth", null, 25),
      rows(25),
      at("localHour", 0, 0.5),
      at("localHour", 1, 1.5),
      at("localHour", 2, 1.5),
      at("localHour", 3, 2.5),
    ],
    expectedIso: {
      0: "2026-10-25T00:30:00+01:00",
      1: "2026-10-25T01:30:00+01:00",
      2: "2026-10-25T01:30:00+00:00",
      3: "2026-10-25T02:30:00+00:00",
      24: "2026-10-25T23:30:00+00:00",
    },
    // 00:00 WEST = 23:00 UTC the day before; row 2 starts at the change instant, 01:00 UTC
    expectedIntervalStartUtc: { 0: "2026-10-24T23:00:00Z", 2: "2026-10-25T01:00:00Z" },
    source: eu,
  },
  {
    id: "local-timeline/europe-paris/2026-03-29",
    label: "Europe/Paris 2026-03-29: 01:30+01:00 then 03:30+02:00",
    input: oneDay("Europe/Paris", "2026-03-29"),
    expected: [rows(23)],
    expectedIso: { 1: "2026-03-29T01:30:00+01:00", 2: "2026-03-29T03:30:00+02:00" },
    source: eu,
  },
  {
    id: "local-timeline/america-new-york/2026-03-08",
    label: "America/New_York 2026-03-08 (second Sunday of March, 02:00 local): 23 rows",
    input: { ...oneDay("America/New_York", "2026-03-08"), ruleDay: { year: 2026, month: 3, nthSunday: 2 } },
    expected: [at("ruleDayOfMonth", null, 8), rows(23)],
    expectedIso: { 0: "2026-03-08T00:30:00-05:00", 1: "2026-03-08T01:30:00-05:00", 2: "2026-03-08T03:30:00-04:00" },
    expectedIntervalStartUtc: { 2: "2026-03-08T07:00:00Z" }, // 02:00 EST = 07:00 UTC
    source: us,
  },
  {
    id: "local-timeline/america-new-york/2026-11-01",
    label: "America/New_York 2026-11-01 (first Sunday of November, 02:00 local): 25 rows",
    input: { ...oneDay("America/New_York", "2026-11-01"), ruleDay: { year: 2026, month: 11, nthSunday: 1 } },
    expected: [at("ruleDayOfMonth", null, 1), rows(25)],
    expectedIso: {
      0: "2026-11-01T00:30:00-04:00",
      1: "2026-11-01T01:30:00-04:00",
      2: "2026-11-01T01:30:00-05:00",
      3: "2026-11-01T02:30:00-05:00",
    },
    expectedIntervalStartUtc: { 2: "2026-11-01T06:00:00Z" }, // 02:00 EDT = 06:00 UTC
    source: us,
  },
  {
    id: "local-timeline/australia-sydney/2026-04-05",
    label: "Australia/Sydney 2026-04-05 (first Sunday of April, 03:00 AEDT → 02:00 AEST): 25 rows",
    input: { ...oneDay("Australia/Sydney", "2026-04-05"), ruleDay: { year: 2026, month: 4, nthSunday: 1 } },
    expected: [at("ruleDayOfMonth", null, 5), rows(25)],
    expectedIso: {
      0: "2026-04-05T00:30:00+11:00",
      1: "2026-04-05T01:30:00+11:00",
      2: "2026-04-05T02:30:00+11:00",
      3: "2026-04-05T02:30:00+10:00",
      4: "2026-04-05T03:30:00+10:00",
    },
    expectedIntervalStartUtc: { 3: "2026-04-04T16:00:00Z" }, // 03:00 AEDT = 16:00 UTC the day before
    source: au,
  },
  {
    id: "local-timeline/australia-sydney/2026-10-04",
    label: "Australia/Sydney 2026-10-04 (first Sunday of October, 02:00 AEST → 03:00 AEDT): 23 rows",
    input: { ...oneDay("Australia/Sydney", "2026-10-04"), ruleDay: { year: 2026, month: 10, nthSunday: 1 } },
    expected: [at("ruleDayOfMonth", null, 4), rows(23)],
    expectedIso: { 0: "2026-10-04T00:30:00+10:00", 1: "2026-10-04T01:30:00+10:00", 2: "2026-10-04T03:30:00+11:00" },
    expectedIntervalStartUtc: { 2: "2026-10-03T16:00:00Z" }, // 02:00 AEST = 16:00 UTC the day before
    source: au,
  },
  {
    id: "local-timeline/australia-adelaide/2026-04-05",
    label: "Australia/Adelaide 2026-04-05 (+10:30 → +09:30): 25 rows",
    input: oneDay("Australia/Adelaide", "2026-04-05"),
    expected: [rows(25)],
    expectedIso: { 0: "2026-04-05T00:30:00+10:30", 24: "2026-04-05T23:30:00+09:30" },
    source: au,
  },
  {
    id: "local-timeline/australia-adelaide/2026-10-04",
    label: "Australia/Adelaide 2026-10-04 (+09:30 → +10:30): 23 rows",
    input: oneDay("Australia/Adelaide", "2026-10-04"),
    expected: [rows(23)],
    expectedIso: { 22: "2026-10-04T23:30:00+10:30" },
    source: au,
  },
  {
    id: "local-timeline/america-santiago/2026-04-04",
    label: "America/Santiago 2026-04-04: 00:00 on the 5th (03:00 UTC) goes back to 23:00 on the 4th → 25 rows, 23:30 twice",
    input: {
      timeZone: "America/Santiago",
      from: "2026-04-04",
      to: "2026-04-05",
      stepMinutes: 60,
      ruleDay: { year: 2026, month: 4, sundayOnOrAfter: 2 },
    },
    expected: [at("ruleDayOfMonth", null, 5), at("dayRowCount", 0, 25), at("dayRowCount", 1, 24), at("localHour", 24, 23.5)],
    expectedIso: {
      22: "2026-04-04T22:30:00-03:00",
      23: "2026-04-04T23:30:00-03:00",
      24: "2026-04-04T23:30:00-04:00",
      25: "2026-04-05T00:30:00-04:00",
    },
    expectedIntervalStartUtc: { 24: "2026-04-05T03:00:00Z" }, // the change instant, 03:00 UTC
    source: chile,
  },
  {
    id: "local-timeline/america-santiago/2026-09-06",
    label: "America/Santiago 2026-09-06: midnight does not exist (04:00 UTC, 00:00 → 01:00); the day starts at 01:00 with 23 rows",
    input: {
      timeZone: "America/Santiago",
      from: "2026-09-05",
      to: "2026-09-06",
      stepMinutes: 60,
      ruleDay: { year: 2026, month: 9, sundayOnOrAfter: 2 },
    },
    expected: [at("ruleDayOfMonth", null, 6), at("dayRowCount", 0, 24), at("dayRowCount", 1, 23), at("dayFirstRow", 1, 24), at("localHour", 24, 1.5)],
    expectedIso: { 23: "2026-09-05T23:30:00-04:00", 24: "2026-09-06T01:30:00-03:00" },
    expectedIntervalStartUtc: { 24: "2026-09-06T04:00:00Z" },
    source: chile,
  },
  {
    id: "local-timeline/australia-lord-howe/2026-04-05",
    label: "Australia/Lord_Howe 2026-04-05 (30-minute shift back): 49 half-hour rows",
    input: oneDay("Australia/Lord_Howe", "2026-04-05", 30),
    expected: [rows(49)],
    source: lordHowe,
  },
  {
    id: "local-timeline/australia-lord-howe/2026-10-04",
    label: "Australia/Lord_Howe 2026-10-04 (30-minute shift forward): 47 half-hour rows",
    input: oneDay("Australia/Lord_Howe", "2026-10-04", 30),
    expected: [rows(47)],
    source: lordHowe,
  },
  {
    id: "local-timeline/asia-kolkata/2026-01-15",
    label: "Asia/Kolkata is +05:30: 00:30 IST = 19:00 UTC the day before",
    input: oneDay("Asia/Kolkata", "2026-01-15"),
    expected: [rows(24), at("offsetMinutes", 0, 330)],
    expectedIso: { 0: "2026-01-15T00:30:00+05:30" },
    expectedEpochUtc: { 0: "2026-01-14T19:00:00Z" },
    source: fixed,
  },
  {
    id: "local-timeline/asia-kathmandu/2026-01-15",
    label: "Asia/Kathmandu is +05:45",
    input: oneDay("Asia/Kathmandu", "2026-01-15"),
    expected: [at("offsetMinutes", 0, 345)],
    expectedIso: { 0: "2026-01-15T00:30:00+05:45" },
    expectedEpochUtc: { 0: "2026-01-14T18:45:00Z" },
    source: fixed,
  },
  {
    id: "local-timeline/africa-monrovia/1960-01-01",
    label: "a historical offset with seconds (Africa/Monrovia, 1960, −00:44:30) prints ±HH:MM:SS",
    input: oneDay("Africa/Monrovia", "1960-01-01", 30),
    expected: [at("offsetMinutes", 0, -44.5)],
    expectedIso: { 0: "1960-01-01T00:15:00-00:44:30" },
    expectedIntervalStartUtc: { 0: "1960-01-01T00:44:30Z" },
    source: fixed,
  },
];

export const localTimeline: ReferenceDomain<LocalTimelineInput> & { readonly cases: readonly LocalTimelineCase[] } = {
  domain: "local-timeline",
  title: "Local timelines with daylight saving",
  cases,
};
