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

  const typed = text("designation");
  if (typed === null) err("designation", "is required");
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
      line,
      column: "designation",
      message: `${designation.reviewNote} Imported and flagged for review.${near}`,
    });
  }

  const qtyText = text("qty");
  let quantity = 1;
  if (qtyText !== null) {
    if (!/^\d+$/.test(qtyText) || Number(qtyText) < 1 || Number(qtyText) > MAX_BUNDLE_QTY)
      err("qty", `"${qtyText}" is not a whole number from 1 to ${MAX_BUNDLE_QTY}`);
    else quantity = Number(qtyText);
  }
  const condition = oneOf("condition", CONDITIONS, "used" as ItemCondition, "nib, nos, used");
  const labelBrand = text("label");
  const makerName = text("maker");
  const basisGiven = (fields.get("maker_basis") ?? "").trim() !== "";
  const basis = oneOf("maker_basis", BASES, "unconfirmed" as AttributionBasis, "confirmed, construction, unconfirmed");
  const source = text("source_code");
  if (basis !== "unconfirmed" && makerName === null)
    err("maker_basis", `"${fields.get("maker_basis")?.trim()}" needs a maker`);
  if (basis === "source-code-confirmed" && source === null)
    err("maker_basis", "confirmed needs the source_code that confirms it");
  if (source !== null) {
    const f = validateSourceCodeFormat(source);
    if (!f.ok)
      warnings.push({
        line,
        column: "source_code",
        message: `"${source}" does not look like a source code: ${f.reason}`,
      });
  }
  const date = text("date_code");
  const readable = date === null ? true : (cache.dateCodeReadable.get(date) ?? readDateCode(date).ok);
  if (date !== null) cache.dateCodeReadable.set(date, readable);
  if (!readable)
    warnings.push({
      line,
      column: "date_code",
      message: `"${date}" could not be read as a date code; kept as printed`,
    });
  const other = text("other_code");

  const features = new Map<string, string>(); // a Map, so names like "constructor" are plain names
  for (const part of list("construction")) {
    const eq = part.indexOf("=");
    const name = eq > 0 ? cleanText(part.slice(0, eq)).toLowerCase() : "";
    const value = eq > 0 ? cleanText(part.slice(eq + 1)) : "";
    if (!name || !value) err("construction", `"${part}" is not name=value`);
    else if (features.has(name) && features.get(name) !== value) err("construction", `"${name}" is given twice`);
    else features.set(name, value);
  }
  const construction: Record<string, string> = Object.fromEntries(features);
  const hazards: HazardKind[] = [];
  for (const h of list("hazards")) {
    const kind = DECLARABLE.find((k) => k === h.toLowerCase());
    if (!kind) err("hazards", `"${h}" is not one of ${DECLARABLE.join(", ")}`);
    else if (!hazards.includes(kind)) hazards.push(kind);
  }
  const vacuumLoss = yesNo("vacuum_loss");
  const defects = list("defects");

  // Readings: sections in order, a measure, a chart value for sections.
  const sections: number[] = [];
  let gap = false;
  let sectionGiven = false;
  for (const column of ["section_1", "section_2", "section_3"]) {
    sectionGiven ||= (fields.get(column) ?? "").trim() !== "";
    const n = num(column);
    if (n === undefined) gap = true;
    else if (gap) err(column, "is given but an earlier section is empty: fill sections from section_1");
    else sections.push(n);
  }
  const chart = num("chart_new", true);
  const plateCurrentMa = num("plate_current_ma");
  const shorts = yesNo("short");
  const leakage = yesNo("leakage");
  const gas = yesNo("gas");
  const measureText = text("measure")?.toLowerCase();
  const measure = MEASURES.find((m) => m === measureText);
  if (measureText !== undefined && !measure) err("measure", `"${measureText}" is not one of ${MEASURES.join(", ")}`);
  const tested = sectionGiven || shorts || leakage || gas;
  if (tested && measureText === undefined) err("measure", "is required on a row with readings");
  if (sectionGiven && chart === undefined) err("chart_new", "is required with section readings, to work out % of new");
  if (!tested && (measureText !== undefined || chart !== undefined || plateCurrentMa !== undefined)) {
    err(
      measureText !== undefined ? "measure" : chart !== undefined ? "chart_new" : "plate_current_ma",
      "is given but the row has no section reading and no failed check",
    );
  }
  if (measure === "emission" && plateCurrentMa !== undefined) err("plate_current_ma", "is not read on an emission run");
  if (tested && quantity !== 1) err("qty", "must be 1 (or empty) on a row with readings: one row per tested tube");

  const tubeRef = text("tube_ref");
  const notes = text("notes", MAX_NOTES_LENGTH);
  if (errors.length > before || designation === null) return null;
  const readings: TubeReading[] = tested
    ? [
        {
          tubeNo: 1,
          sections,
          measure: measure!,
          ...(chart !== undefined ? { chartNewValue: chart } : {}),
          ...(plateCurrentMa !== undefined ? { plateCurrentMa } : {}),
          shorts,
          leakage,
          gas,
        },
      ]
    : [];
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
