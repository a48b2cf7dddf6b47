/**
 * Bulk import of a consignment from our own CSV format (columns in
 * csv-columns.ts). Refuses oversized files before parsing them, reports row
 * errors and warnings by the 1-based file line where the record starts (the
 * header is line 1), and gives a file fingerprint and per-row keys so a
 * re-import of the same file adds nothing.
 *
 * Normalisation [SUG, ours], applied before fingerprints and keys: a leading
 * byte-order mark is dropped, CRLF/CR become LF, header names are trimmed and
 * lower-cased, every field is trimmed with whitespace runs collapsed to one
 * space, blank lines are skipped. So column order and whitespace-only edits
 * change neither the fingerprint nor the row keys; reordering rows changes
 * the fingerprint but not the row keys.
 */
import { createHash } from "node:crypto";
import { parse } from "csv-parse/sync";
import { normaliseDesignation } from "../valves/designation";
import { IMPORT_COLUMN_NAMES } from "./csv-columns";
import type { ReferenceTable } from "../valves/reference-table";
import { cleanText, newRowCache, readLotRow, type CsvIssue, type RowContent } from "./csv-row";
import type { ItemInput } from "../validation/lots";
import { checkRowItem } from "./csv-item";
import type { LotItem } from "./item";

export { IMPORT_COLUMNS, IMPORT_COLUMN_NAMES, csvTemplate, type ImportColumn } from "./csv-columns";
export type { CsvIssue } from "./csv-row";

/** Default limits [SUG]: 5,000 data rows, 2 MiB. */
export const DEFAULT_MAX_ROWS = 5000;
/** See DEFAULT_MAX_ROWS. */
export const DEFAULT_MAX_BYTES = 2 * 1024 * 1024;

/** One imported row: the item, the consignor's references and a stable key. */
export interface ParsedRow extends RowContent {
  /** Line in the file where the record starts (header = 1). */
  line: number;
  /** Stable across re-imports: see rowKey. */
  key: string;
  item: LotItem;
  /** The row as the item form would send it, checked by the form's schema (ItemSchema). */
  input: ItemInput;
}

/**
 * Result of parseLotCsv. Errors with line 0 concern the whole file (size,
 * CSV syntax, header) and nothing is imported; rows with errors are left out.
 */
export interface LotCsvResult {
  rows: ParsedRow[];
  errors: CsvIssue[];
  warnings: CsvIssue[];
  unknownColumns: string[];
  /** sha256 hex of the normalised file; null when the file was refused unread. */
  fingerprint: string | null;
  /** The rows' keys, in row order. */
  rowKeys: string[];
}

/** Limits for parseLotCsv. */
export interface ParseLotCsvOptions {
  maxRows?: number;
  maxBytes?: number;
}

/** UTF-8 length of text, counted until it passes limit. */
function utf8LengthUpTo(text: string, limit: number): number {
  let bytes = 0;
  for (let i = 0; i < text.length && bytes <= limit; i += 1) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c < 0xdc00 && i + 1 < text.length) {
      bytes += 4;
      i += 1;
    } else bytes += 3;
  }
  return bytes;
}

const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");
const fmt = (n: number) => n.toLocaleString("en-US");

/** Non-blank records after the header, counted up to limit + 1 by a quote-aware scan. */
function countDataRows(text: string, limit: number): number {
  let records = 0;
  let inQuotes = false;
  let blank = true;
  for (let i = 0; i < text.length; i += 1) {
    const c = text.charCodeAt(i);
    if (c === 34) inQuotes = !inQuotes;
    if (c === 10 && !inQuotes) {
      if (!blank) records += 1;
      blank = true;
      if (records > limit + 1) break;
    } else if (c !== 32 && c !== 9 && c !== 44) blank = false;
  }
  if (!blank) records += 1;
  return Math.max(0, records - 1);
}

function refuse(message: string): LotCsvResult {
  return { rows: [], errors: [{ line: 0, message }], warnings: [], unknownColumns: [], fingerprint: null, rowKeys: [] };
}

/** JSON with object keys sorted, so equal content always serialises the same. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
    return `{${entries
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
      .map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`)
      .join(",")}}`;
  }
  return JSON.stringify(value ?? null);
}

/**
 * Key of a row: sha256 of its normalised content plus how many identical rows
 * came before it in the file. Content is what the consignor wrote, read
 * (designation normalised, enums and numbers parsed, hazards sorted), never
 * what our type lists make of it, so updating those lists keeps keys stable.
 */
export function rowKey(row: RowContent, occurrence: number): string {
  const { item } = row;
  const n = normaliseDesignation(item.designation.typed);
  const content = {
    ...item,
    designation: n.ok ? n.value : item.designation.typed,
    hazards: [...item.hazards].sort(),
    tubeRef: row.tubeRef,
    notes: row.notes,
  };
  return sha256(`${canonical(content)}\n${occurrence}`);
}

function syntaxMessage(e: unknown): CsvIssue {
  const err = e as { code?: string; lines?: number };
  const line = typeof err.lines === "number" ? err.lines : 0;
  const what =
    err.code === "CSV_QUOTE_NOT_CLOSED"
      ? "a quoted field is never closed (look for an opening quote on or before this line)"
      : err.code === "CSV_INVALID_CLOSING_QUOTE"
        ? "text follows a closing quote; double any quote inside a quoted field"
        : "the file could not be read as CSV";
  return { line: 0, message: `The file is not valid CSV near line ${line}: ${what}. Nothing was imported.` };
}

/**
 * Parses a lot CSV. Files over maxBytes (default 2 MiB) or with more than
 * maxRows data rows (default 5,000) are refused with one file-level error
 * before any parsing. Unknown designations are imported and flagged (a
 * warning); bad values are row errors with the line the record starts on.
 */
export function parseLotCsv(table: ReferenceTable, text: string, options: ParseLotCsvOptions = {}): LotCsvResult {
  const maxRows = options.maxRows ?? DEFAULT_MAX_ROWS;
  const maxBytes = options.maxBytes ?? DEFAULT_MAX_BYTES;
  // A UTF-16 code unit is at least one UTF-8 byte, so a long string is refused without encoding it.
  if (text.length > maxBytes || utf8LengthUpTo(text, maxBytes) > maxBytes) {
    return refuse(`The file is larger than ${fmt(maxBytes)} bytes. Split it into smaller files and import each.`);
  }
  const normalised = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  let newlines = 0;
  for (let i = normalised.indexOf("\n"); i !== -1 && newlines <= maxRows + 1; i = normalised.indexOf("\n", i + 1))
    newlines += 1;
  if (newlines > maxRows && countDataRows(normalised, maxRows) > maxRows) {
    return refuse(
      `The file has more than ${fmt(maxRows)} data rows. Split it into files of at most ${fmt(maxRows)} rows and import each.`,
    );
  }

  let records: { raw: string; record: string[] }[];
  try {
    records = parse(normalised, { raw: true, relax_column_count: true, skip_empty_lines: true }) as {
      raw: string;
      record: string[];
    }[];
  } catch (e) {
    return { ...refuse(""), errors: [syntaxMessage(e)] };
  }
  // Start line of each record: lines consumed so far plus the blank lines skipped before it.
  let consumed = 0;
  const located = records.map(({ raw, record }) => {
    const leading = /^\n*/.exec(raw)![0].length;
    const line = consumed + leading + 1;
    consumed += raw.split("\n").length - 1;
    return { line, fields: record };
  });

  const header = located.shift();
  if (!header) return refuse("The file is empty: a header row naming the columns is required.");
  const names = header.fields.map((f) => cleanText(f).toLowerCase());
  const order = names.map((_, i) => i).sort((a, b) => (names[a] < names[b] ? -1 : names[a] > names[b] ? 1 : a - b));
  const body = located.filter((r) => r.fields.some((f) => f.trim() !== ""));
  const fingerprint = sha256(
    canonical([
      order.map((i) => names[i]),
      ...body.map((r) => [
        ...order.map((i) => cleanText(r.fields[i] ?? "")),
        ...r.fields.slice(names.length).map(cleanText),
      ]),
    ]),
  );

  const errors: CsvIssue[] = [];
  const warnings: CsvIssue[] = [];
  const unknownColumns: string[] = [];
  names.forEach((name, i) => {
    if (name === "") warnings.push({ line: 1, message: `column ${i + 1} has no name; ignored` });
    else if (names.indexOf(name) !== i)
      errors.push({ line: 1, column: name, message: `column "${name}" appears more than once` });
    else if (!IMPORT_COLUMN_NAMES.includes(name)) {
      unknownColumns.push(name);
      warnings.push({ line: 1, column: name, message: `unknown column "${name}" ignored` });
    }
  });
  if (!names.includes("designation"))
    errors.push({ line: 1, column: "designation", message: "the header has no designation column" });
  if (errors.length > 0) return { rows: [], errors, warnings, unknownColumns, fingerprint, rowKeys: [] };

  const rows: ParsedRow[] = [];
  const seen = new Map<string, number>();
  const cache = newRowCache(table);
  for (const r of body) {
    if (r.fields.length !== names.length) {
      errors.push({
        line: r.line,
        message: `expected ${names.length} fields as in the header, found ${r.fields.length}`,
      });
      continue;
    }
    const fields = new Map<string, string>();
    names.forEach((name, i) => {
      if (IMPORT_COLUMN_NAMES.includes(name)) fields.set(name, r.fields[i]);
    });
    const content = readLotRow(r.line, fields, errors, warnings, cache);
    if (!content) continue;
    const input = checkRowItem(r.line, content, errors); // the item form's own schema, on the CSV's columns
    if (!input) continue;
    const contentKey = rowKey(content, 0);
    const occurrence = seen.get(contentKey) ?? 0;
    seen.set(contentKey, occurrence + 1);
    rows.push({ ...content, input, line: r.line, key: occurrence === 0 ? contentKey : rowKey(content, occurrence) });
  }
  return { rows, errors, warnings, unknownColumns, fingerprint, rowKeys: rows.map((r) => r.key) };
}
