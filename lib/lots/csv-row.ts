/**
 * One data row of the lot CSV (see csv-columns.ts) read into a LotItem, with
 * every problem on the row reported at once. Free text is trimmed and its
 * whitespace runs (line breaks included) collapsed to one space, so
 * whitespace-only edits do not change a row.
 */
import type { ReferenceTable } from "../valves/reference-table";
import { readDateCode } from "../valves/date-code";
import type { TestMeasure } from "../valves/grading";
import type { HazardKind } from "../valves/index-types";
import { validateSourceCodeFormat } from "../valves/source-code";
import { MAX_BUNDLE_QTY, MAX_NOTES_LENGTH, MAX_TEXT_LENGTH, NO_WORDS, YES_WORDS } from "./csv-columns";
import {
  describeDesignation,
  type AttributionBasis,
  type ItemCondition,
  type ItemDesignation,
  type LotItem,
  type TubeReading,
} from "./item";

/** A problem on one line; `column` names the CSV column when there is one. */
export interface CsvIssue {
  line: number;
  column?: string;
  message: string;
}

/** A row read from the CSV. */
export interface RowContent {
  item: LotItem;
  tubeRef: string | null;
  notes: string | null;
}

const CONDITIONS: Readonly<Record<string, ItemCondition>> = {
  nib: "new-in-box",
  "new-in-box": "new-in-box",
  nos: "new-old-stock",
  "new-old-stock": "new-old-stock",
  used: "used",
};
const BASES: Readonly<Record<string, AttributionBasis>> = {
  confirmed: "source-code-confirmed",
  "source-code-confirmed": "source-code-confirmed",
  construction: "construction-matched",
  "construction-matched": "construction-matched",
  unconfirmed: "unconfirmed",
};
const MEASURES: readonly TestMeasure[] = ["gm", "emission", "plate-current"];
const DECLARABLE: readonly HazardKind[] = ["mercury-vapour", "radioactive", "beryllium-oxide"];
const NUMBER = /^\d+(?:\.\d+)?$/;
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/** Look-ups shared by the rows of one file: lots repeat the same designations and codes. */
export interface RowCache {
  /** The house's reference table the file is read against. */
  reference: ReferenceTable;
  designations: Map<string, ItemDesignation>;
  dateCodeReadable: Map<string, boolean>;
}

/** A fresh RowCache for one file. */
export function newRowCache(reference: ReferenceTable): RowCache {
  return { reference, designations: new Map(), dateCodeReadable: new Map() };
}

/** Trim and collapse whitespace runs to one space. */
export function cleanText(value: string): string {
  return value.replace(/\s+/g, " ").trim();
}

/** The column readers of one row; each problem is pushed to the file's errors as it is found. */
interface RowReader {
  line: number;
  fields: ReadonlyMap<string, string>;
  err: (column: string | undefined, message: string) => void;
  text: (column: string, max?: number) => string | null;
  oneOf: <T>(column: string, table: Readonly<Record<string, T>>, fallback: T, shown: string) => T;
  yesNo: (column: string) => boolean;
  num: (column: string, positive?: boolean) => number | undefined;
  list: (column: string) => string[];
}

/** Readers bound to one row and its line number. */
function rowReader(line: number, fields: ReadonlyMap<string, string>, errors: CsvIssue[]): RowReader {
  const err = (column: string | undefined, message: string) =>
    errors.push({ line, ...(column ? { column } : {}), message });
  const text = (column: string, max = MAX_TEXT_LENGTH): string | null => {
    const raw = fields.get(column) ?? "";
    if (CONTROL.test(raw)) {
      err(column, "contains a control character");
      return null;
    }
    const v = cleanText(raw);
    if (v.length > max) err(column, `is ${v.length} characters long; at most ${max}`);
    return v === "" ? null : v;
  };
  const oneOf = <T>(column: string, table: Readonly<Record<string, T>>, fallback: T, shown: string): T => {
    const v = text(column);
    if (v === null) return fallback;
    const found = Object.hasOwn(table, v.toLowerCase()) ? table[v.toLowerCase()] : undefined;
    if (found === undefined) err(column, `"${v}" is not one of ${shown}`);
    return found ?? fallback;
  };
  const yesNo = (column: string): boolean => {
    const v = text(column)?.toLowerCase();
    if (v === undefined) return false;
    if (YES_WORDS.includes(v)) return true;
    if (!NO_WORDS.includes(v)) err(column, `"${v}" is not yes or no`);
    return false;
  };
  const num = (column: string, positive = false): number | undefined => {
    const v = text(column);
    if (v === null) return undefined;
    if (!NUMBER.test(v)) {
      err(column, `"${v}" is not a number (digits and one decimal point, no separators)`);
      return undefined;
    }
    const n = Number(v);
    if (positive && n <= 0) err(column, "must be above 0");
    return n;
  };
  const list = (column: string): string[] =>
    (text(column) ?? "")
      .split(";")
      .map(cleanText)
      .filter((s) => s !== "");
  return { line, fields, err, text, oneOf, yesNo, num, list };
}

/** The designation looked up in the reference table (required); an unknown one is kept and flagged for review. */
function readDesignation(r: RowReader, cache: RowCache, warnings: CsvIssue[]): ItemDesignation | null {
  const typed = r.text("designation");
  if (typed === null) r.err("designation", "is required");
  let designation: ItemDesignation | null = null;
  if (typed !== null) {
    const known = cache.designations.get(typed) ?? describeDesignation(cache.reference, typed);
    cache.designations.set(typed, known);
    designation = { ...known, ...(known.candidates ? { candidates: [...known.candidates] } : {}) };
  }
  if (designation?.status === "unknown-flagged") {
    const near = designation.candidates?.length
      ? ` Did you mean ${designation.candidates.slice(0, 3).join(", ")}?`
      : "";
    warnings.push({
      line: r.line,
      column: "designation",
      message: `${designation.reviewNote} Imported and flagged for review.${near}`,
    });
  }
  return designation;
}

/** How many tubes the row bundles: 1 when empty. */
function readQuantity(r: RowReader): number {
  const qtyText = r.text("qty");
  let quantity = 1;
  if (qtyText !== null) {
    if (!/^\d+$/.test(qtyText) || Number(qtyText) < 1 || Number(qtyText) > MAX_BUNDLE_QTY)
      r.err("qty", `"${qtyText}" is not a whole number from 1 to ${MAX_BUNDLE_QTY}`);
    else quantity = Number(qtyText);
  }
  return quantity;
}

/** The label, the attributed maker with the basis for it, and the source code that may confirm it. */
function readAttribution(r: RowReader, warnings: CsvIssue[]) {
  const labelBrand = r.text("label");
  const makerName = r.text("maker");
  const basisGiven = (r.fields.get("maker_basis") ?? "").trim() !== "";
  const basis = r.oneOf(
    "maker_basis",
    BASES,
    "unconfirmed" as AttributionBasis,
    "confirmed, construction, unconfirmed",
  );
  const source = r.text("source_code");
  if (basis !== "unconfirmed" && makerName === null)
    r.err("maker_basis", `"${r.fields.get("maker_basis")?.trim()}" needs a maker`);
  if (basis === "source-code-confirmed" && source === null)
    r.err("maker_basis", "confirmed needs the source_code that confirms it");
  if (source !== null) {
    const f = validateSourceCodeFormat(source);
    if (!f.ok)
      warnings.push({
        line: r.line,
        column: "source_code",
        message: `"${source}" does not look like a source code: ${f.reason}`,
      });
  }
  return { labelBrand, makerName, basisGiven, basis, source };
}

/** The date code as printed; one that cannot be read is kept with a warning. */
function readDateCodeColumn(r: RowReader, cache: RowCache, warnings: CsvIssue[]): string | null {
  const date = r.text("date_code");
  const readable = date === null ? true : (cache.dateCodeReadable.get(date) ?? readDateCode(date).ok);
  if (date !== null) cache.dateCodeReadable.set(date, readable);
  if (!readable)
    warnings.push({
      line: r.line,
      column: "date_code",
      message: `"${date}" could not be read as a date code; kept as printed`,
    });
  return date;
}

/** Construction features as name=value pairs separated by semicolons. */
function readConstruction(r: RowReader): Record<string, string> {
  const features = new Map<string, string>(); // a Map, so names like "constructor" are plain names
  for (const part of r.list("construction")) {
    const eq = part.indexOf("=");
    const name = eq > 0 ? cleanText(part.slice(0, eq)).toLowerCase() : "";
    const value = eq > 0 ? cleanText(part.slice(eq + 1)) : "";
    if (!name || !value) r.err("construction", `"${part}" is not name=value`);
    else if (features.has(name) && features.get(name) !== value) r.err("construction", `"${name}" is given twice`);
    else features.set(name, value);
  }
  return Object.fromEntries(features);
}

/** Declared hazards, each once. */
function readHazards(r: RowReader): HazardKind[] {
  const hazards: HazardKind[] = [];
  for (const h of r.list("hazards")) {
    const kind = DECLARABLE.find((k) => k === h.toLowerCase());
    if (!kind) r.err("hazards", `"${h}" is not one of ${DECLARABLE.join(", ")}`);
    else if (!hazards.includes(kind)) hazards.push(kind);
  }
  return hazards;
}

/** The test columns of a row as read, before they are known to be free of errors. */
interface ReadingColumns {
  tested: boolean;
  sections: number[];
  measure: TestMeasure | undefined;
  chart: number | undefined;
  plateCurrentMa: number | undefined;
  shorts: boolean;
  leakage: boolean;
  gas: boolean;
}

/** Readings: sections in order, a measure, a chart value for sections; a tested row is one tube. */
function readReadings(r: RowReader, quantity: number): ReadingColumns {
  const sections: number[] = [];
  let gap = false;
  let sectionGiven = false;
  for (const column of ["section_1", "section_2", "section_3"]) {
    sectionGiven ||= (r.fields.get(column) ?? "").trim() !== "";
    const n = r.num(column);
    if (n === undefined) gap = true;
    else if (gap) r.err(column, "is given but an earlier section is empty: fill sections from section_1");
    else sections.push(n);
  }
  const chart = r.num("chart_new", true);
  const plateCurrentMa = r.num("plate_current_ma");
  const shorts = r.yesNo("short");
  const leakage = r.yesNo("leakage");
  const gas = r.yesNo("gas");
  const measureText = r.text("measure")?.toLowerCase();
  const measure = MEASURES.find((m) => m === measureText);
  if (measureText !== undefined && !measure) r.err("measure", `"${measureText}" is not one of ${MEASURES.join(", ")}`);
  const tested = sectionGiven || shorts || leakage || gas;
  if (tested && measureText === undefined) r.err("measure", "is required on a row with readings");
  if (sectionGiven && chart === undefined)
    r.err("chart_new", "is required with section readings, to work out % of new");
  if (!tested && (measureText !== undefined || chart !== undefined || plateCurrentMa !== undefined)) {
    r.err(
      measureText !== undefined ? "measure" : chart !== undefined ? "chart_new" : "plate_current_ma",
      "is given but the row has no section reading and no failed check",
    );
  }
  if (measure === "emission" && plateCurrentMa !== undefined)
    r.err("plate_current_ma", "is not read on an emission run");
  if (tested && quantity !== 1) r.err("qty", "must be 1 (or empty) on a row with readings: one row per tested tube");
  return { tested, sections, measure, chart, plateCurrentMa, shorts, leakage, gas };
}

/** The one tube reading of an error-free tested row (none for an untested one). */
function toReadings(c: ReadingColumns): TubeReading[] {
  return c.tested
    ? [
        {
          tubeNo: 1,
          sections: c.sections,
          measure: c.measure!,
          ...(c.chart !== undefined ? { chartNewValue: c.chart } : {}),
          ...(c.plateCurrentMa !== undefined ? { plateCurrentMa: c.plateCurrentMa } : {}),
          shorts: c.shorts,
          leakage: c.leakage,
          gas: c.gas,
        },
      ]
    : [];
}

/**
 * Reads one row. `fields` maps lower-case column names to raw values.
 * Returns the row, or null when it has errors; warnings never block a row.
 */
export function readLotRow(
  line: number,
  fields: ReadonlyMap<string, string>,
  errors: CsvIssue[],
  warnings: CsvIssue[],
  cache: RowCache,
): RowContent | null {
  const before = errors.length;
  const r = rowReader(line, fields, errors);
  const designation = readDesignation(r, cache, warnings);
  const quantity = readQuantity(r);
  const condition = r.oneOf("condition", CONDITIONS, "used" as ItemCondition, "nib, nos, used");
  const { labelBrand, makerName, basisGiven, basis, source } = readAttribution(r, warnings);
  const date = readDateCodeColumn(r, cache, warnings);
  const other = r.text("other_code");
  const construction = readConstruction(r);
  const hazards = readHazards(r);
  const vacuumLoss = r.yesNo("vacuum_loss");
  const defects = r.list("defects");
  const readingColumns = readReadings(r, quantity);
  const tubeRef = r.text("tube_ref");
  const notes = r.text("notes", MAX_NOTES_LENGTH);
  if (errors.length > before || designation === null) return null;
  const readings = toReadings(readingColumns);
  if (!basisGiven && makerName !== null)
    warnings.push({ line, column: "maker_basis", message: "maker given without maker_basis: recorded as unconfirmed" });
  const codes = {
    ...(source !== null ? { source } : {}),
    ...(date !== null ? { date } : {}),
    ...(other !== null ? { other } : {}),
  };
  return {
    item: {
      designation,
      quantity,
      labelBrand,
      attributedMaker: { makerName, basis },
      codes,
      construction,
      condition,
      vacuumLoss,
      defects,
      hazards,
      readings,
    },
    tubeRef,
    notes,
  };
}
