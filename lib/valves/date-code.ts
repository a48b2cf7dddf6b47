/**
 * Date codes on receiving tubes: EIA "YYWW"/"YWW" codes, read into ranked
 * candidate dates (the etched European date line is read in ./date-line-eu).
 *
 * The reader never silently picks one decade [SUG]: every surviving reading
 * is listed with its reasons, and every dropped one with why it was dropped.
 */
import { splitJoinedCode } from "./source-code";

/** Digit layouts a printed date code can have. WWYY is not EIA and is only read on request. */
export type DateCodeForm = "YYWW" | "YWW" | "WWYY";

/** Warnings attached to a reading result. */
export type DateCodeFlag =
  | "joined-source-code"
  | "may-be-source-code"
  | "ambiguous-decade"
  | "predates-type"
  | "after-end-of-production"
  | "predates-suffix"
  | "contradicts-evidence"
  | "week-53"
  | "type-introduction-unknown"
  | "no-plausible-year";

/** Outside evidence about a tube's era (construction, label, box style). */
export interface EraEvidence {
  earliest?: number;
  latest?: number;
  /** What the evidence is, shown in reasons ("grey plates", "box style"). */
  source: string;
  /** True: years outside are impossible. False/absent: years inside are merely favoured. */
  rulesOut?: boolean;
}

/** What is known about the tube the code was read from. */
export interface DateCodeContext {
  /** Year the type was introduced (e.g. 12AX7: 1947 [MEM, secondary histories]). */
  introducedYear?: number;
  /** Last year the house expects production of the type; default DEFAULT_END_OF_PRODUCTION_YEAR. */
  endOfProductionYear?: number;
  /** Envelope suffix of the designation, e.g. "GT" for 6SN7GT. */
  envelopeSuffix?: string;
  /** Overrides the built-in earliest year for the suffix. */
  earliestSuffixYear?: number;
  eraEvidence?: EraEvidence[];
  /** Also read four digits week-first (some in-house codes); off by default. */
  considerWeekFirst?: boolean;
}

/** One candidate date for a code. Rank 1 is the most plausible. */
export interface DateReading {
  year: number;
  week: number;
  form: DateCodeForm;
  score: number;
  rank: number;
  reasons: string[];
}

/** A reading that was considered and dropped, with the reason. */
export interface RejectedReading {
  reading: { form: DateCodeForm; year?: number; week?: number };
  reason: string;
}

/** Outcome of readDateCode: candidates, or an error for text that is not a date code. */
export type DateCodeResult =
  | {
      ok: true;
      input: string;
      digits: string;
      sourceCode?: string;
      readings: DateReading[];
      rejected: RejectedReading[];
      flags: DateCodeFlag[];
    }
  | {
      ok: false;
      input: string;
      error: { code: "empty" | "not-digits" | "wrong-length" | "invalid-week"; message: string };
      rejected: RejectedReading[];
    };

/** House setting: last production year assumed when none is given [SUG]. */
export const DEFAULT_END_OF_PRODUCTION_YEAR = 1990;
/** House setting: earliest year considered when the type's introduction is unknown [SUG]. */
export const DEFAULT_EARLIEST_YEAR = 1930;
/** Highest week number: weeks 01–52, occasionally 53 [EIA-476; CTP]. */
export const MAX_WEEK = 53;
/**
 * Earliest plausible year per envelope suffix. GT bulbs not before the late
 * 1930s [MEM]; GTA/GTB improve on GT so cannot predate it [SUG, follows from §2.1].
 */
export const SUFFIX_EARLIEST_YEAR: Readonly<Record<string, number>> = {
  GT: 1938,
  "GT/G": 1938,
  GTA: 1938,
  GTB: 1938,
};

/** Why a candidate year is doubtful (conflicts) or favoured (supports). */
export interface YearVerdict {
  conflicts: { flag: DateCodeFlag; reason: string }[];
  supports: string[];
}

/** Check one candidate year against the type, suffix and outside evidence. */
export function judgeYear(year: number, ctx: DateCodeContext): YearVerdict {
  const verdict: YearVerdict = { conflicts: [], supports: [] };
  const end = ctx.endOfProductionYear ?? DEFAULT_END_OF_PRODUCTION_YEAR;
  if (ctx.introducedYear !== undefined && year < ctx.introducedYear) {
    verdict.conflicts.push({
      flag: "predates-type",
      reason: `${year} is before the type was introduced (${ctx.introducedYear})`,
    });
  } else if (ctx.introducedYear === undefined && year < DEFAULT_EARLIEST_YEAR) {
    verdict.conflicts.push({
      flag: "predates-type",
      reason: `${year} is before ${DEFAULT_EARLIEST_YEAR}, the house's earliest year for an unknown type`,
    });
  }
  if (year > end) {
    verdict.conflicts.push({
      flag: "after-end-of-production",
      reason: `${year} is after the configured end of production (${end})`,
    });
  }
  const suffix = ctx.envelopeSuffix?.toUpperCase();
  const suffixYear = ctx.earliestSuffixYear ?? (suffix ? SUFFIX_EARLIEST_YEAR[suffix] : undefined);
  if (suffixYear !== undefined && year < suffixYear) {
    verdict.conflicts.push({
      flag: "predates-suffix",
      reason: `${year} is before the ${suffix ?? "suffix"} envelope existed (${suffixYear})`,
    });
  }
  for (const evidence of ctx.eraEvidence ?? []) {
    const inside =
      (evidence.earliest === undefined || year >= evidence.earliest) &&
      (evidence.latest === undefined || year <= evidence.latest);
    if (evidence.rulesOut && !inside) {
      verdict.conflicts.push({ flag: "contradicts-evidence", reason: `${year} contradicts ${evidence.source}` });
    } else if (!evidence.rulesOut && inside) {
      verdict.supports.push(`${year} fits ${evidence.source}`);
    }
  }
  return verdict;
}

/**
 * Years ending in `digit` from a decade before the type's introduction to a
 * decade after the end of production; judgeYear then drops the outsiders, so
 * the dropped neighbours appear in the rejected list with their reason.
 */
export function decadeCandidates(digit: number, ctx: DateCodeContext): number[] {
  const from = (ctx.introducedYear ?? DEFAULT_EARLIEST_YEAR) - 10;
  const to = (ctx.endOfProductionYear ?? DEFAULT_END_OF_PRODUCTION_YEAR) + 10;
  const years: number[] = [];
  for (let year = from - (from % 10) + digit; year <= to; year += 10) if (year >= from) years.push(year);
  return years;
}

/** Does the ISO 8601 calendar give this year a week 53? (Thursday rule [ISO 8601].) */
export function hasIsoWeek53(year: number): boolean {
  const jan1 = new Date(Date.UTC(year, 0, 1)).getUTCDay();
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return jan1 === 4 || (leap && jan1 === 3);
}

/**
 * Rank readings: more supporting evidence first; ties go to the year nearest
 * the type's introduction (the earliest surviving year) [SUG], and say so.
 */
export function rankReadings<T extends { year: number; score: number; rank: number; reasons: string[] }>(
  readings: T[],
): T[] {
  const sorted = [...readings].sort((a, b) => b.score - a.score || a.year - b.year);
  sorted.forEach((reading, index) => {
    reading.rank = index + 1;
    if (sorted.some((other) => other !== reading && other.score === reading.score && other.year !== reading.year)) {
      reading.reasons.push("tied on evidence with another decade; ordered by nearness to the type's introduction");
    }
  });
  return sorted;
}

const validWeek = (week: number) => week >= 1 && week <= MAX_WEEK;
/** The reasons a candidate year conflicts, in one line. */
export const joinConflicts = (verdict: YearVerdict) => verdict.conflicts.map((c) => c.reason).join("; ");

type AddReading = (year: number, week: number, form: DateCodeForm, verdict: YearVerdict, extra: string[]) => void;

/**
 * YYWW: try 19YY and 20YY. Centuries that conflict are dropped when another is
 * clean; if none is clean the literal 19YY reading stays, flagged [CTP].
 */
function readCentury(
  yy: number,
  week: number,
  ctx: DateCodeContext,
  rejected: RejectedReading[],
  flags: DateCodeFlag[],
  addReading: AddReading,
): void {
  const judged = [1900 + yy, 2000 + yy].map((year) => ({ year, verdict: judgeYear(year, ctx) }));
  const clean = judged.filter((j) => j.verdict.conflicts.length === 0);
  const label = `YYWW: year ${String(yy).padStart(2, "0")}, week ${week}`;
  for (const { year, verdict } of judged) {
    const keep = clean.length > 0 ? verdict.conflicts.length === 0 : year < 2000;
    if (!keep) {
      rejected.push({ reading: { form: "YYWW", year, week }, reason: joinConflicts(verdict) });
      continue;
    }
    for (const conflict of verdict.conflicts) if (!flags.includes(conflict.flag)) flags.push(conflict.flag);
    addReading(year, week, "YYWW", verdict, [label]);
  }
}

/** The refusal of a code that is empty, not digits, or not 3 or 4 digits long (null when it has a date code's shape). */
function refuseMalformed(input: string, text: string, rejected: RejectedReading[]): DateCodeResult | null {
  if (text === "") return { ok: false, input, error: { code: "empty", message: "no date code given" }, rejected };
  if (!/^\d+$/.test(text)) {
    return {
      ok: false,
      input,
      error: { code: "not-digits", message: `"${text}" is not a date code: EIA date codes are digits only` },
      rejected,
    };
  }
  if (text.length !== 3 && text.length !== 4) {
    return {
      ok: false,
      input,
      error: {
        code: "wrong-length",
        message: `"${text}" has ${text.length} digits; EIA date codes have 3 (YWW) or 4 (YYWW)`,
      },
      rejected,
    };
  }
  return null;
}

/** An AddReading that scores a candidate from its verdict and collects it into `readings`. */
function readingCollector(readings: DateReading[]): AddReading {
  return (year, week, form, verdict, extra) => {
    const reasons = [...extra, ...verdict.supports, ...verdict.conflicts.map((c) => c.reason)];
    if (week === MAX_WEEK) reasons.push(`week 53: ${year} ${hasIsoWeek53(year) ? "has" : "has no"} ISO week 53`);
    const score = verdict.supports.length - 2 * verdict.conflicts.length - (form === "WWYY" ? 1 : 0);
    readings.push({ year, week, form, score, rank: 0, reasons });
  };
}

/** Four digits week-first (WWYY), read only on request and only when the year is clean; true if a week was valid. */
function readWeekFirst(
  text: string,
  ctx: DateCodeContext,
  rejected: RejectedReading[],
  addReading: AddReading,
): boolean {
  const first = Number(text.slice(0, 2));
  const second = Number(text.slice(2));
  if (!validWeek(first)) {
    rejected.push({
      reading: { form: "WWYY", week: first },
      reason: `week-first reading impossible: week ${text.slice(0, 2)} cannot exist`,
    });
  } else if (!ctx.considerWeekFirst) {
    rejected.push({
      reading: { form: "WWYY", year: 1900 + second, week: first },
      reason: "week-first order is not EIA-476; enable it only for a maker known to print it",
    });
  } else {
    const verdict = judgeYear(1900 + second, ctx);
    if (verdict.conflicts.length > 0) {
      rejected.push({ reading: { form: "WWYY", year: 1900 + second, week: first }, reason: joinConflicts(verdict) });
    } else {
      addReading(1900 + second, first, "WWYY", verdict, ["week-first order (not EIA-476), read on request"]);
      return true;
    }
  }
  return false;
}

/** Four digits: YYWW in either century, then the week-first reading; true if any week was valid. */
function readFourDigits(
  text: string,
  ctx: DateCodeContext,
  rejected: RejectedReading[],
  flags: DateCodeFlag[],
  addReading: AddReading,
): boolean {
  let weekValid = false;
  const first = Number(text.slice(0, 2));
  const second = Number(text.slice(2));
  if (validWeek(second)) {
    weekValid = true;
    readCentury(first, second, ctx, rejected, flags, addReading);
  } else {
    rejected.push({
      reading: { form: "YYWW", year: 1900 + first, week: second },
      reason: `week ${text.slice(2)} cannot exist (weeks run 01–${MAX_WEEK})`,
    });
  }
  if (readWeekFirst(text, ctx, rejected, addReading)) weekValid = true;
  return weekValid;
}

/** Three digits (YWW): one candidate per decade that survives judgeYear; true if the week was valid. */
function readThreeDigits(
  text: string,
  ctx: DateCodeContext,
  rejected: RejectedReading[],
  flags: DateCodeFlag[],
  addReading: AddReading,
): boolean {
  const digit = Number(text[0]);
  const week = Number(text.slice(1));
  flags.push("may-be-source-code");
  if (!validWeek(week)) {
    rejected.push({
      reading: { form: "YWW", week },
      reason: `week ${text.slice(1)} cannot exist (weeks run 01–${MAX_WEEK})`,
    });
    return false;
  }
  if (ctx.introducedYear === undefined) flags.push("type-introduction-unknown");
  for (const year of decadeCandidates(digit, ctx)) {
    const verdict = judgeYear(year, ctx);
    if (verdict.conflicts.length > 0) {
      rejected.push({ reading: { form: "YWW", year, week }, reason: joinConflicts(verdict) });
    } else {
      addReading(year, week, "YWW", verdict, [`YWW: year digit ${digit}, week ${week}; decade inferred`]);
    }
  }
  return true;
}

/**
 * Read an EIA date code ("5943", "943", or joined "X46-5943") into ranked
 * candidate dates. Four digits are YYWW [EIA-476]; three digits are YWW and
 * give one candidate per decade between the type's introduction and the end
 * of production, never before the introduction [CTP].
 */
export function readDateCode(code: string, ctx: DateCodeContext = {}): DateCodeResult {
  const input = code;
  let text = code.trim();
  const flags: DateCodeFlag[] = [];
  const rejected: RejectedReading[] = [];
  let sourceCode: string | undefined;
  const joined = splitJoinedCode(text);
  if (joined) {
    sourceCode = joined.sourcePart;
    text = joined.datePart;
    flags.push("joined-source-code");
  }
  const malformed = refuseMalformed(input, text, rejected);
  if (malformed) return malformed;
  const readings: DateReading[] = [];
  const addReading = readingCollector(readings);
  const weekValid =
    text.length === 4
      ? readFourDigits(text, ctx, rejected, flags, addReading)
      : readThreeDigits(text, ctx, rejected, flags, addReading);
  if (!weekValid) {
    return {
      ok: false,
      input,
      error: {
        code: "invalid-week",
        message: `"${text}" has no valid week (01–${MAX_WEEK}): not a date code, or misread`,
      },
      rejected,
    };
  }
  if (readings.length === 0) flags.push("no-plausible-year");
  if (readings.length > 1) flags.push("ambiguous-decade");
  if (readings.some((r) => r.week === MAX_WEEK)) flags.push("week-53");
  const result: DateCodeResult = { ok: true, input, digits: text, readings: rankReadings(readings), rejected, flags };
  if (sourceCode) result.sourceCode = sourceCode;
  return result;
}
