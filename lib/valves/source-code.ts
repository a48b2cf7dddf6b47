/**
 * EIA source codes: format checks, registry look-up and the admin CSV import.
 *
 * A source code is a registered three-digit number naming "the production
 * source or the vendor assuming product responsibility" [EIA-476 registers],
 * so on a rebranded tube it may name the brand owner rather than the factory.
 * A match is therefore evidence towards an attribution, never proof.
 */
import { parse } from "csv-parse/sync";
import { z } from "zod";

/** One row of the house's maker registry (demo rows carry invented codes). */
export interface MakerRegistryEntry {
  code: string;
  makerName: string;
  isDemo: boolean;
  notes: string;
}

/** Result of checking the printed form of a source code. */
export type SourceCodeFormat =
  { ok: true; code: string; prefix?: "EIA" | "RMA"; dateCode?: string } | { ok: false; input: string; reason: string };

/** Result of looking a source code up in the registry. */
export type SourceCodeLookup =
  | {
      ok: true;
      code: string;
      found: boolean;
      entries: MakerRegistryEntry[];
      /** Always "evidence": the code may name the brand owner [EIA-476]. */
      strength: "evidence";
      caveat: string;
      /** True when every matching entry is invented demo data. */
      demoOnly: boolean;
      flags: ("several-entries" | "demo-data")[];
    }
  | { ok: false; input: string; reason: string };

/** A row-level problem found while importing the registry CSV. */
export interface CsvRowError {
  line: number;
  message: string;
}

/** Wording shown beside every source-code match [EIA-476 registers]. */
export const SOURCE_CODE_CAVEAT =
  "A source code names the production source or the vendor assuming product responsibility; " +
  "on a rebranded tube it may name the brand owner. Treat it as evidence, not proof.";

// Registered codes are three digits: "EIA 274", "RMA-274", "274", "274-5943" [EIA-476; CTP "sss-YYWW" when
// printed together]. Demo codes are "X" and two digits ("X46"): a form the registers never used, so an
// invented demo code can never be mistaken for a registered one [SUG].
const SOURCE_CODE_PATTERN = /^(?:(EIA|RMA)[\s-]?)?(\d{3}|X\d{2})(?:[\s-](\d{3,4}))?$/i;

/** Whether a code is in the invented demo form ("X46"), never a registered code [SUG]. */
export function isDemoSourceCode(code: string): boolean {
  return /^X\d{2}$/i.test(code.trim());
}

/**
 * Split a code printed joined as "sss-YYWW" (or "sss-YWW") into its parts.
 * Returns null when the text is not in that joined form.
 */
export function splitJoinedCode(text: string): { sourcePart: string; datePart: string } | null {
  const match = /^(\d{3}|X\d{2})[\s-](\d{3,4})$/i.exec(text.trim());
  return match ? { sourcePart: match[1], datePart: match[2] } : null;
}

/**
 * Check the printed form of an EIA source code: three digits, optionally
 * (or an invented demo code "X" + two digits), optionally prefixed "EIA" or
 * "RMA", optionally joined to a date code ("274-5943", "X46-5943").
 */
export function validateSourceCodeFormat(text: string): SourceCodeFormat {
  const input = text;
  const trimmed = text.trim();
  if (trimmed === "") return { ok: false, input, reason: "empty: no source code given" };
  const match = SOURCE_CODE_PATTERN.exec(trimmed);
  if (!match) {
    const digits = trimmed.replace(/\D/g, "");
    const reason =
      /^(?:(EIA|RMA)[\s-]?)?\d+$/i.test(trimmed) && digits.length !== 3
        ? `a source code has exactly three digits, got ${digits.length}`
        : "not a source code: expected three digits, optionally prefixed EIA or RMA";
    return { ok: false, input, reason };
  }
  const prefix = match[1] ? (match[1].toUpperCase() as "EIA" | "RMA") : undefined;
  const result: SourceCodeFormat = { ok: true, code: match[2].toUpperCase() };
  if (prefix) result.prefix = prefix;
  if (match[3]) result.dateCode = match[3];
  return result;
}

/**
 * Look a source code up in the maker registry. The answer is evidence only:
 * the registered holder may be the vendor or brand owner, not the factory.
 */
export function lookupSourceCode(code: string, registry: readonly MakerRegistryEntry[]): SourceCodeLookup {
  const format = validateSourceCodeFormat(code);
  if (!format.ok) return { ok: false, input: code, reason: format.reason };
  const entries = registry.filter((entry) => entry.code === format.code);
  const demoOnly = entries.length > 0 && entries.every((entry) => entry.isDemo);
  const flags: ("several-entries" | "demo-data")[] = [];
  if (entries.length > 1) flags.push("several-entries");
  if (entries.some((entry) => entry.isDemo)) flags.push("demo-data");
  return {
    ok: true,
    code: format.code,
    found: entries.length > 0,
    entries,
    strength: "evidence",
    caveat: SOURCE_CODE_CAVEAT,
    demoOnly,
    flags,
  };
}

const REGISTRY_COLUMNS = ["code", "maker_name", "is_demo", "notes"] as const;
const TRUE_WORDS = ["true", "yes", "y", "1"];
const FALSE_WORDS = ["false", "no", "n", "0"];

const registryRowSchema = z.object({
  code: z.string().trim().min(1, "code is required"),
  maker_name: z.string().trim().min(1, "maker_name is required").max(120, "maker_name is longer than 120 characters"),
  is_demo: z
    .string()
    .trim()
    .toLowerCase()
    .pipe(z.enum([...TRUE_WORDS, ...FALSE_WORDS] as [string, ...string[]], { error: "is_demo must be true or false" })),
  notes: z.string().trim().max(1000, "notes are longer than 1000 characters"),
});

/**
 * Parse the admin's maker-registry CSV (columns code, maker_name, is_demo,
 * notes; header row required, any column order; RFC 4180 quoting). Rows with
 * problems are left out and reported with the line they start on.
 */
export function parseMakerRegistryCsv(text: string): { rows: MakerRegistryEntry[]; errors: CsvRowError[] } {
  const rows: MakerRegistryEntry[] = [];
  const errors: CsvRowError[] = [];
  const { records, errors: syntaxErrors } = parseCsvRecords(text);
  errors.push(...syntaxErrors);
  const header = records.shift();
  if (!header)
    return { rows, errors: [...errors, { line: 1, message: "the file is empty: a header row is required" }] };

  const names = header.fields.map((name) => name.trim().toLowerCase());
  const missing = REGISTRY_COLUMNS.filter((column) => !names.includes(column));
  if (missing.length > 0) {
    errors.push({ line: header.line, message: `header lacks column(s): ${missing.join(", ")}` });
    return { rows, errors };
  }
  const seen = new Map<string, number>();
  for (const record of records) {
    if (record.fields.length === 1 && record.fields[0].trim() === "") continue; // blank line
    if (record.fields.length !== names.length) {
      errors.push({ line: record.line, message: `expected ${names.length} fields, found ${record.fields.length}` });
      continue;
    }
    const raw = Object.fromEntries(names.map((name, index) => [name, record.fields[index]]));
    const parsed = registryRowSchema.safeParse(raw);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) errors.push({ line: record.line, message: issue.message });
      continue;
    }
    const format = validateSourceCodeFormat(parsed.data.code);
    if (!format.ok || format.dateCode) {
      errors.push({
        line: record.line,
        message: `code "${parsed.data.code}": ${format.ok ? "remove the date part" : format.reason}`,
      });
      continue;
    }
    const earlier = seen.get(format.code);
    if (earlier !== undefined) {
      errors.push({ line: record.line, message: `code ${format.code} already given on line ${earlier}` });
      continue;
    }
    seen.set(format.code, record.line);
    rows.push({
      code: format.code,
      makerName: parsed.data.maker_name,
      isDemo: TRUE_WORDS.includes(parsed.data.is_demo),
      notes: parsed.data.notes,
    });
  }
  return { rows, errors };
}

/** Our own words for csv-parse's syntax errors (its codes), so a house user reads what to fix. */
const CSV_SYNTAX_MESSAGES: Record<string, string> = {
  CSV_QUOTE_NOT_CLOSED: "a quoted field is not closed before the end of the file",
  CSV_INVALID_CLOSING_QUOTE: "text after the closing quote of a field",
  INVALID_OPENING_QUOTE: "stray quote inside an unquoted field",
};

/**
 * Read RFC 4180 records with csv-parse (commas, double-quoted fields with ""
 * escapes, CRLF or LF line ends, line breaks inside quotes). Each record keeps
 * the line it starts on, counted from the raw text (csv-parse's own count
 * runs ahead after a CRLF inside quotes). A syntax error stops the reading:
 * the records before it are kept and the error names the line its record
 * starts on.
 */
function parseCsvRecords(text: string): { records: { line: number; fields: string[] }[]; errors: CsvRowError[] } {
  const records: { line: number; fields: string[] }[] = [];
  let line = 1;
  try {
    parse(text, {
      bom: true,
      relax_column_count: true,
      raw: true,
      on_record: ({ record, raw }: { record: string[]; raw: string }) => {
        records.push({ line, fields: record });
        line += raw.match(/\r\n|\n|\r/g)?.length ?? 0;
        return null;
      },
    });
  } catch (e) {
    const code = (e as { code?: string }).code ?? "";
    return {
      records,
      errors: [{ line, message: CSV_SYNTAX_MESSAGES[code] ?? "the file is not valid CSV (RFC 4180)" }],
    };
  }
  return { records, errors: [] };
}
