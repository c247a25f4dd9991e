/**
 * A CSV file of measured panes for the library: one pane a row, checked with the same schema as a pane saved
 * through POST /api/v1/orgs/:orgId/panes (PaneCreateRequest, whose measured values follow the glazing
 * contract's MeasuredValues), so that the rules and messages agree; the messages name the file's columns.
 */
import { PANE_COLUMNS, PANE_REQUIRED_COLUMNS, MAX_PANE_ROWS, type UploadError } from "@/lib/contracts/uploads";
import { PaneCreateRequest } from "@/lib/contracts/library";
import { cell, decodeText, ErrorList, numberCell, readCsv } from "./csv";

/** The file's column for each field of a pane request (by the last key of the zod issue's path). */
const COLUMN_OF_FIELD: Record<string, string> = {
  name: "name",
  note: "note",
  thicknessMm: "thickness_mm",
  solarTransmittance: "solar_t",
  solarReflectanceFront: "solar_rf",
  solarReflectanceBack: "solar_rb",
  visibleTransmittance: "light_t",
  visibleReflectanceFront: "light_rf",
  visibleReflectanceBack: "light_rb",
  emissivityFront: "emissivity_front",
  emissivityBack: "emissivity_back",
};
const FIELD_NAMES = new RegExp(`\\b(${Object.keys(COLUMN_OF_FIELD).join("|")})\\b`, "g");

/** The schema's message with its field names written as the file's columns. */
const inColumns = (message: string) => message.replace(FIELD_NAMES, (k) => COLUMN_OF_FIELD[k]!);

export type PanesCsvResult = { ok: true; panes: PaneCreateRequest[]; rowCount: number } | { ok: false; errors: UploadError[] };

export function validatePanesCsv(bytes: Uint8Array): PanesCsvResult {
  const errors = new ErrorList();
  const text = decodeText(bytes, errors);
  const table = text === null ? null : readCsv(text, PANE_COLUMNS, PANE_REQUIRED_COLUMNS, MAX_PANE_ROWS, errors);
  if (!table) return { ok: false, errors: errors.list() };

  const panes: PaneCreateRequest[] = [];
  for (const { line, cells } of table.rows) {
    const before = errors.count;
    const num = (column: string) => numberCell(cell(table, cells, column), line, column, errors);
    const thicknessMm = num("thickness_mm");
    const values = {
      solarTransmittance: num("solar_t"),
      solarReflectanceFront: num("solar_rf"),
      solarReflectanceBack: num("solar_rb"),
      visibleTransmittance: num("light_t"),
      visibleReflectanceFront: num("light_rf"),
      visibleReflectanceBack: num("light_rb"),
    };
    const emissivityFront = num("emissivity_front");
    const emissivityBack = num("emissivity_back");
    for (const [column, v] of [
      ["thickness_mm", thicknessMm],
      ["solar_t", values.solarTransmittance],
      ["solar_rf", values.solarReflectanceFront],
      ["solar_rb", values.solarReflectanceBack],
    ] as const)
      if (v === null) errors.add(line, column, `${column} is needed for every pane`);
    if (errors.count > before) continue;

    const given = <T>(v: T | null | undefined) => (v === null || v === undefined ? undefined : v);
    const note = cell(table, cells, "note");
    const request = {
      name: cell(table, cells, "name"),
      layer: {
        thicknessMm,
        measured: Object.fromEntries(Object.entries(values).filter(([, v]) => given(v) !== undefined)),
        ...(given(emissivityFront) !== undefined ? { emissivityFront } : {}),
        ...(given(emissivityBack) !== undefined ? { emissivityBack } : {}),
      },
      ...(note ? { note } : {}),
    };
    const parsed = PaneCreateRequest.safeParse(request);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = [...issue.path].reverse().find((p) => typeof p === "string" && p in COLUMN_OF_FIELD) as string | undefined;
        errors.add(line, key ? COLUMN_OF_FIELD[key]! : "(row)", inColumns(issue.message));
      }
      continue;
    }
    panes.push(parsed.data);
  }
  return errors.count ? { ok: false, errors: errors.list() } : { ok: true, panes, rowCount: table.rows.length };
}
