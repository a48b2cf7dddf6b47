/**
 * A CSV row checked by the same item schema as the item form (ItemSchema),
 * so the file and the form accept the same things and nothing longer than
 * its column reaches the database. The schema's problems are reported on the
 * CSV columns the values came from.
 */
import { ItemSchema, type ItemInput } from "../validation/lots";
import type { CsvIssue, RowContent } from "./csv-row";

/** The CSV column each field of the item form is read from. */
export const ITEM_FIELD_COLUMNS: Readonly<Record<keyof ItemInput, string>> = {
  designation: "designation",
  quantity: "qty",
  labelBrand: "label",
  makerName: "maker",
  makerBasis: "maker_basis",
  sourceCode: "source_code",
  dateCode: "date_code",
  features: "construction",
  condition: "condition",
  vacuumLoss: "vacuum_loss",
  soldAsSet: "qty",
  defects: "defects",
  hazards: "hazards",
  readings: "section_1",
  notes: "notes",
};

/** The reading fields and their columns (section n is column section_n). */
const READING_COLUMNS: Readonly<Record<string, string>> = {
  measure: "measure",
  chartNewValue: "chart_new",
  plateCurrentMa: "plate_current_ma",
  shorts: "short",
  leakage: "leakage",
  gas: "gas",
};

/** What the item form would be sent for this row (the tube reference goes in front of the notes). */
export function itemFormValues(row: RowContent): unknown {
  const i = row.item;
  return {
    designation: i.designation.typed,
    quantity: i.quantity,
    labelBrand: i.labelBrand ?? "",
    makerName: i.attributedMaker.makerName,
    makerBasis: i.attributedMaker.basis,
    sourceCode: i.codes.source ?? null,
    dateCode: i.codes.date ?? null,
    features: { ...i.construction, ...(i.codes.other ? { otherCode: i.codes.other } : {}) },
    condition: i.condition,
    vacuumLoss: i.vacuumLoss,
    defects: i.defects,
    hazards: i.hazards,
    readings: i.readings.map((r) => ({ ...r, tubeNo: r.tubeNo ?? 1 })),
    notes: [row.tubeRef ? `Tube ref ${row.tubeRef}` : "", row.notes ?? ""].filter(Boolean).join(" · "),
  };
}

/** The CSV column a schema issue's path points at. */
export function columnOfPath(path: ReadonlyArray<PropertyKey>): string {
  const [field, , sub, index] = path.map(String);
  if (field === "features" && path[1] === "otherCode") return "other_code";
  if (field === "readings" && sub === "sections") return `section_${Number(index ?? 0) + 1}`;
  if (field === "readings" && sub && READING_COLUMNS[sub]) return READING_COLUMNS[sub]!;
  return ITEM_FIELD_COLUMNS[field as keyof ItemInput] ?? field ?? "designation";
}

/**
 * Check a row with ItemSchema. Returns the checked item, or null after adding
 * each problem to `errors` on its CSV column (a too-long value says how long
 * it is and what the column holds: never cut short).
 */
export function checkRowItem(line: number, row: RowContent, errors: CsvIssue[]): ItemInput | null {
  const values = itemFormValues(row);
  const r = ItemSchema.safeParse(values);
  if (r.success) return r.data;
  const seen = new Set<string>();
  for (const issue of r.error.issues) {
    const column = columnOfPath(issue.path);
    let message = issue.message.charAt(0).toLowerCase() + issue.message.slice(1);
    if (issue.code === "too_big" && issue.origin === "string") {
      const given = valueAt(values, issue.path);
      if (typeof given === "string") message = `is ${given.trim().length} characters long; at most ${issue.maximum}`;
    }
    const key = `${column}\n${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    errors.push({ line, column, message });
  }
  return null;
}

function valueAt(value: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let v = value;
  for (const k of path) v = v && typeof v === "object" ? (v as Record<PropertyKey, unknown>)[k] : undefined;
  return v;
}
