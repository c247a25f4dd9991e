/**
 * Reading an uploaded CSV file into rows with papaparse, and the bookkeeping every upload shares: the header
 * (known, required and repeated columns), line numbers as a spreadsheet shows them (the header is line 1, a
 * quoted value over several lines still counts as one row), cells by column name, numbers in words, and a
 * list of problems that keeps every one of them (up to MAX_UPLOAD_ERRORS).
 */
import Papa from "papaparse";
import { MAX_UPLOAD_ERRORS, type UploadError } from "@/lib/contracts/uploads";

export class ErrorList {
  readonly items: UploadError[] = [];
  private dropped = 0;
  add(line: number, column: string, message: string): void {
    if (this.items.length < MAX_UPLOAD_ERRORS) this.items.push({ line, column, message });
    else this.dropped++;
  }
  get count(): number {
    return this.items.length + this.dropped;
  }
  /** The problems, with a last entry saying how many were left out when there were too many. */
  list(): UploadError[] {
    return this.dropped
      ? [...this.items, { line: 0, column: "(file)", message: `${this.dropped} more problems were found and are not listed; fix these first` }]
      : this.items;
  }
}

export interface CsvTable {
  /** Column name → index in each row. */
  columns: Map<string, number>;
  /** Data rows with their line numbers; blank rows are left out. */
  rows: { line: number; cells: string[] }[];
}

/** UTF-8 text of the file (a byte-order mark removed), or the line of the first byte that is not UTF-8. */
export function decodeText(bytes: Uint8Array, errors: ErrorList): string | null {
  try {
    return new TextDecoder("utf-8", { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    const loose = new TextDecoder("utf-8").decode(bytes);
    const at = loose.indexOf("\uFFFD");
    const line = loose.slice(0, Math.max(0, at)).split("\n").length;
    errors.add(line, "(file)", "the file is not UTF-8 text; save it from the spreadsheet as “CSV UTF-8”");
    return null;
  }
}

/**
 * Parses CSV text and checks its header against the columns an upload knows. Returns null (with the problems
 * in `errors`) when the header cannot be used; rows beyond `maxRows` are refused as a whole.
 */
export function readCsv(text: string, known: readonly string[], required: readonly string[], maxRows: number, errors: ErrorList): CsvTable | null {
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false, delimiter: "" });
  const data = parsed.data;
  for (const e of parsed.errors) {
    // papaparse guesses the delimiter; a file of one column is fine for it to flag, but not for us to report.
    if (e.code === "UndetectableDelimiter") continue;
    errors.add((e.row ?? 0) + 1, "(row)", `the row cannot be read as CSV: ${e.message}`);
  }
  if (data.length === 0 || data[0]!.every((c) => c.trim() === "")) {
    errors.add(1, "(header)", `the first line must name the columns: ${known.join(",")}`);
    return null;
  }
  const header = data[0]!.map((c) => c.trim().toLowerCase());
  const columns = new Map<string, number>();
  header.forEach((name, i) => {
    if (name === "") errors.add(1, `column ${i + 1}`, "this column has no name in the header");
    else if (!known.includes(name)) errors.add(1, name, `“${name}” is not a column of this upload; the columns are ${known.join(", ")}`);
    else if (columns.has(name)) errors.add(1, name, `the column “${name}” appears twice`);
    else columns.set(name, i);
  });
  for (const r of required) if (!columns.has(r)) errors.add(1, r, `the column “${r}” is missing from the header`);
  if (errors.count) return null;

  const rows: CsvTable["rows"] = [];
  for (let i = 1; i < data.length; i++) {
    const cells = data[i]!;
    if (cells.every((c) => c.trim() === "")) continue;
    if (rows.length === maxRows) {
      errors.add(i + 1, "(file)", `the file holds more than ${maxRows} data rows; split it`);
      return null;
    }
    if (cells.length !== header.length) errors.add(i + 1, "(row)", `this row has ${cells.length} values; the header names ${header.length} columns`);
    rows.push({ line: i + 1, cells });
  }
  if (rows.length === 0) errors.add(2, "(file)", "the file has a header but no data rows");
  return { columns, rows };
}

/** The cell of a column in a row, trimmed; "" when the column is not in the file or the row is short. */
export function cell(table: CsvTable, cells: string[], column: string): string {
  const i = table.columns.get(column);
  return i === undefined ? "" : (cells[i] ?? "").trim();
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * A number from a cell, or undefined with a problem added. Empty cells are `null` (the caller decides whether
 * that is allowed).
 */
export function numberCell(raw: string, line: number, column: string, errors: ErrorList): number | null | undefined {
  if (raw === "") return null;
  if (NUMBER.test(raw)) return Number(raw);
  if (/^[+-]?\d+,\d+$/.test(raw)) errors.add(line, column, `“${raw}” is not a number: write the decimal point as “.”, not “,”`);
  else errors.add(line, column, `“${raw.slice(0, 40)}” is not a number`);
  return undefined;
}
