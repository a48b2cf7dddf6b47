/**
 * Etched European date lines (a month letter and a year digit), read into
 * candidate dates with the same year checks as printed date codes
 * (./date-code). Month-letter schemes vary by factory [CTP/MEM].
 */
import { decadeCandidates, joinConflicts, judgeYear, rankReadings, type DateCodeContext } from "./date-code";

/** Month-letter schemes for etched European date lines [CTP/MEM]. */
export type MonthLetterScheme = "A-L" | "skip-I";

/** Month letters per scheme: A–L = Jan–Dec in one widely cited scheme; others skip I [CTP/MEM, verify per factory]. */
export const MONTH_LETTERS: Readonly<Record<MonthLetterScheme, string>> = {
  "A-L": "ABCDEFGHIJKL",
  "skip-I": "ABCDEFGHJKLM",
};

/** One candidate date for an etched European date line. */
export interface EuropeanDateReading {
  year: number;
  month: number;
  scheme: MonthLetterScheme;
  score: number;
  rank: number;
  reasons: string[];
}

/** Outcome of parseEuropeanDateLine. */
export type EuropeanDateResult =
  | {
      ok: true;
      input: string;
      factorySymbol: string;
      yearDigit: number;
      monthLetter: string;
      /** Week digit of later codes; read as week within the month [MEM, verify]. */
      weekDigit?: number;
      readings: EuropeanDateReading[];
      rejected: { year: number; reason: string }[];
      flags: (
        | "ambiguous-decade"
        | "month-scheme-ambiguous"
        | "no-factory-symbol"
        | "week-digit-out-of-range"
        | "no-plausible-year"
      )[];
    }
  | { ok: false; input: string; error: { code: "empty" | "not-a-date-line" | "not-a-month-letter"; message: string } };

/**
 * Read line two of an etched European code: factory symbol + year digit +
 * month letter + optional week digit (e.g. "¤7C2", "¤" an invented demo
 * symbol) [CTP/MEM]. The decade is
 * not in the code, so every decade between the type's introduction and the
 * end of production is offered, ranked like readDateCode. With `schemes`
 * holding both letter schemes, each differing month is offered too.
 */
export function parseEuropeanDateLine(
  line: string,
  ctx: DateCodeContext & { schemes?: MonthLetterScheme[] } = {},
): EuropeanDateResult {
  const input = line;
  const text = line.replace(/\s+/g, "").toUpperCase();
  if (text === "") return { ok: false, input, error: { code: "empty", message: "no date line given" } };
  const match = /^(.*?)(\d)([A-Z])(\d)?$/u.exec(text);
  if (!match) {
    return {
      ok: false,
      input,
      error: { code: "not-a-date-line", message: `"${text}" does not end in year digit + month letter (+ week digit)` },
    };
  }
  const [, factorySymbol, yearText, monthLetter, weekText] = match;
  const schemes = ctx.schemes ?? ["A-L"];
  const months = schemes
    .map((scheme) => ({ scheme, month: MONTH_LETTERS[scheme].indexOf(monthLetter) + 1 }))
    .filter((m) => m.month > 0)
    .filter((m, i, all) => all.findIndex((other) => other.month === m.month) === i);
  if (months.length === 0) {
    return {
      ok: false,
      input,
      error: {
        code: "not-a-month-letter",
        message: `"${monthLetter}" is not a month letter in scheme ${schemes.join(" or ")}`,
      },
    };
  }
  const flags: Extract<EuropeanDateResult, { ok: true }>["flags"] = [];
  if (factorySymbol === "") flags.push("no-factory-symbol");
  const weekDigit = weekText === undefined ? undefined : Number(weekText);
  if (weekDigit !== undefined && (weekDigit < 1 || weekDigit > 5)) flags.push("week-digit-out-of-range");
  if (months.length > 1) flags.push("month-scheme-ambiguous");

  const readings: EuropeanDateReading[] = [];
  const rejected: { year: number; reason: string }[] = [];
  for (const year of decadeCandidates(Number(yearText), ctx)) {
    const verdict = judgeYear(year, ctx);
    if (verdict.conflicts.length > 0) {
      rejected.push({ year, reason: joinConflicts(verdict) });
      continue;
    }
    for (const { scheme, month } of months) {
      const reasons = [
        `year digit ${yearText}, decade inferred`,
        `month letter ${monthLetter} = month ${month} (${scheme})`,
        ...verdict.supports,
      ];
      readings.push({ year, month, scheme, score: verdict.supports.length, rank: 0, reasons });
    }
  }
  if (readings.length === 0) flags.push("no-plausible-year");
  if (new Set(readings.map((r) => r.year)).size > 1) flags.push("ambiguous-decade");
  const result: EuropeanDateResult = {
    ok: true,
    input,
    factorySymbol,
    yearDigit: Number(yearText),
    monthLetter,
    readings: rankReadings(readings),
    rejected,
    flags,
  };
  if (weekDigit !== undefined) result.weekDigit = weekDigit;
  return result;
}
