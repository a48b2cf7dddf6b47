/**
 * Getterline's own CSV format for bulk import of a consignment's tubes with
 * tester readings. A header row is required; columns may come in any order,
 * header names are case-insensitive, unknown columns are reported and ignored.
 * Only `designation` is required. Blank lines are skipped. Fields may be
 * quoted (RFC 4180), so commas and line breaks can appear inside quotes.
 *
 * Each data row is either one tested tube (it has a section reading or a
 * failed short/leakage/gas check) or a bundle of `qty` untested tubes.
 */

/** One column of the import format, for validation and the docs/template. */
export interface ImportColumn {
  name: string;
  required: boolean;
  /** Accepted values, in short. */
  values: string;
  /** What the column means and its default. */
  description: string;
}

/** Largest qty on one bundle row [SUG]. */
export const MAX_BUNDLE_QTY = 10_000;
/** Longest free-text field (label, maker, codes, construction, defects) [SUG]. */
export const MAX_TEXT_LENGTH = 200;
/** Longest notes field [SUG]. */
export const MAX_NOTES_LENGTH = 1000;

/** Every column the importer understands, in template order. */
export const IMPORT_COLUMNS: readonly ImportColumn[] = [
  {
    name: "designation",
    required: true,
    values: "type designation",
    description:
      "Type as printed (12AX7, ECC83, 6SN7GT). Case, spaces and hyphens are cleaned. Types we do not list are imported and flagged for review.",
  },
  {
    name: "qty",
    required: false,
    values: `whole number 1–${MAX_BUNDLE_QTY}`,
    description:
      "Tubes on the row; default 1. A row with readings is one tube, so qty must be empty or 1 there; a row without readings is a bundle of qty untested tubes.",
  },
  {
    name: "condition",
    required: false,
    values: "nib | nos | used",
    description:
      "nib: new in the original box; nos: new old stock, never in service; used: removed from equipment. Default used: a tube is never taken as unused without a claim.",
  },
  {
    name: "label",
    required: false,
    values: "text",
    description: "Brand printed on the tube, as printed. The label is not necessarily the maker.",
  },
  { name: "maker", required: false, values: "text", description: "Factory the consignor attributes the tube to." },
  {
    name: "maker_basis",
    required: false,
    values: "confirmed | construction | unconfirmed",
    description:
      "Why: confirmed by the source code (needs maker and source_code), matched by construction (needs maker), or unconfirmed. Default unconfirmed.",
  },
  {
    name: "source_code",
    required: false,
    values: "text",
    description: "EIA source code as printed (e.g. X31). Evidence of the maker, not proof.",
  },
  {
    name: "date_code",
    required: false,
    values: "text",
    description: "Date code as printed (e.g. 6214 for 1962 week 14).",
  },
  {
    name: "other_code",
    required: false,
    values: "text",
    description: "Any other printed or etched code (factory or change codes).",
  },
  {
    name: "construction",
    required: false,
    values: "name=value; name=value",
    description: "Construction features, e.g. plates=grey box; getter=halo top; micas=3. Names are lower-cased.",
  },
  {
    name: "vacuum_loss",
    required: false,
    values: "yes | no",
    description: "White or milky getter (air leak) on every tube of the row. Default no.",
  },
  {
    name: "defects",
    required: false,
    values: "text; text",
    description: "Visible defects separated by semicolons (bent pin; loose base).",
  },
  {
    name: "hazards",
    required: false,
    values: "mercury-vapour; radioactive; beryllium-oxide",
    description: "Hazards the consignor declares, separated by semicolons, beyond those our type data lists.",
  },
  {
    name: "measure",
    required: false,
    values: "gm | emission | plate-current",
    description: "What the tester measured. Required on a row with readings.",
  },
  {
    name: "section_1",
    required: false,
    values: "number ≥ 0",
    description: "Reading of section 1 in the tester's units (digits and one decimal point).",
  },
  {
    name: "section_2",
    required: false,
    values: "number ≥ 0",
    description: "Reading of section 2 (dual triodes and other two-section types).",
  },
  {
    name: "section_3",
    required: false,
    values: "number ≥ 0",
    description: "Reading of section 3, for three-section types.",
  },
  {
    name: "chart_new",
    required: false,
    values: "number > 0",
    description: 'The tester chart\'s "new" value for the type, in the same units. Required with section readings.',
  },
  {
    name: "plate_current_ma",
    required: false,
    values: "number ≥ 0",
    description: "Plate current in mA at the tester's stated bias (Gm or plate-current runs).",
  },
  { name: "short", required: false, values: "yes | no", description: "Short found. Default no." },
  { name: "leakage", required: false, values: "yes | no", description: "Excess leakage found. Default no." },
  { name: "gas", required: false, values: "yes | no", description: "Gas found. Default no." },
  {
    name: "tube_ref",
    required: false,
    values: "text",
    description: "The consignor's own number for the tube, kept for reference.",
  },
  { name: "notes", required: false, values: "text", description: `Free notes, up to ${MAX_NOTES_LENGTH} characters.` },
];

/** Column names, lower case, in template order. */
export const IMPORT_COLUMN_NAMES: readonly string[] = IMPORT_COLUMNS.map((c) => c.name);

/** Yes/no words accepted in yes|no columns, case-insensitive; blank means no. */
export const YES_WORDS: readonly string[] = ["yes", "y", "true", "1"];
/** See YES_WORDS. */
export const NO_WORDS: readonly string[] = ["no", "n", "false", "0"];

// Invented demo data only: makers and source codes are the demo cast's.
const TEMPLATE_ROWS: readonly Record<string, string>[] = [
  {
    designation: "12AX7",
    qty: "1",
    condition: "nos",
    label: "Vireo Lamp & Valve",
    maker: "Aldergrove Electron Works",
    maker_basis: "construction",
    date_code: "6214",
    construction: "plates=grey box; getter=halo top; micas=3",
    vacuum_loss: "no",
    measure: "gm",
    section_1: "1450",
    section_2: "1520",
    chart_new: "1600",
    short: "no",
    leakage: "no",
    gas: "no",
    tube_ref: "A-001",
    notes: "Sleeved, print sharp, faint pin marks",
  },
  {
    designation: "EL84",
    qty: "1",
    condition: "used",
    label: "Kestrel Valve Company",
    maker: "Kestrel Valve Company",
    maker_basis: "confirmed",
    source_code: "X31",
    date_code: "6748",
    construction: "plates=black ribbed; getter=D side",
    vacuum_loss: "no",
    defects: "print worn",
    measure: "gm",
    section_1: "9800",
    chart_new: "11000",
    plate_current_ma: "44",
    short: "no",
    leakage: "no",
    gas: "no",
    tube_ref: "A-002",
  },
  {
    designation: "6V6GT",
    qty: "12",
    condition: "nib",
    label: "Pellham Radio Tube Corp.",
    maker_basis: "unconfirmed",
    vacuum_loss: "no",
    notes: "Untested, original boxes, two boxes scuffed",
  },
];

function csvField(value: string): string {
  return /[",\r\n]/.test(value) || value !== value.trim() ? `"${value.replace(/"/g, '""')}"` : value;
}

/** The import template: the header with every column, then three example rows of invented data. */
export function csvTemplate(): string {
  const lines = [IMPORT_COLUMN_NAMES.join(",")];
  for (const row of TEMPLATE_ROWS) lines.push(IMPORT_COLUMN_NAMES.map((name) => csvField(row[name] ?? "")).join(","));
  return `${lines.join("\n")}\n`;
}
