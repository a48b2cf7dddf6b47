// Cleans a type designation as a consignor types it: "12ax7a" -> "12AX7A",
// "12AX7-A" -> "12AX7A", "ecc 83" -> "ECC83", full-width "１２ＡＸ７" -> "12AX7".

/** Longest designation we accept after cleaning (the longest real ones are about 10 characters). */
export const MAX_DESIGNATION_LENGTH = 32;

/** Raw inputs longer than this are refused before any Unicode work, to bound the cost. */
const MAX_RAW_LENGTH = 256;

/** Why a designation could not be cleaned. */
export type NormaliseErrorCode = "empty" | "too-long" | "bad-characters";

/** Outcome of normaliseDesignation: the cleaned value and what was changed, or a reason. */
export type NormaliseResult =
  | { readonly ok: true; readonly value: string; readonly changes: readonly string[] }
  | { readonly ok: false; readonly error: NormaliseErrorCode; readonly message: string };

// Cyrillic and Greek capitals that look like Latin ones. Folding them stops a
// pasted "ЕСС83" (Cyrillic) from becoming a separate, unfindable type.
const LOOK_ALIKES: Readonly<Record<string, string>> = {
  "\u0410": "A",
  "\u0412": "B",
  "\u0421": "C",
  "\u0415": "E",
  "\u041D": "H",
  "\u0406": "I",
  "\u0408": "J",
  "\u041A": "K",
  "\u041C": "M",
  "\u041E": "O",
  "\u0420": "P",
  "\u0405": "S",
  "\u0422": "T",
  "\u0425": "X",
  "\u0423": "Y",
  "\u04AE": "Y",
  "\u0391": "A",
  "\u0392": "B",
  "\u0395": "E",
  "\u0396": "Z",
  "\u0397": "H",
  "\u0399": "I",
  "\u039A": "K",
  "\u039C": "M",
  "\u039D": "N",
  "\u039F": "O",
  "\u03A1": "P",
  "\u03A4": "T",
  "\u03A5": "Y",
  "\u03A7": "X",
};

const DASHES = /[\u2010-\u2015\u2212\uFE58\uFE63]/g;
const INVISIBLE_OR_CONTROL = /[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]/u;
const SEPARATORS = /[\s\-_.]+/g;
const ALLOWED = /^[A-Z0-9/]*$/;
// "OA2", "OD3": a letter O typed for the zero of a cold-cathode type (0A2, 0D3).
const LETTER_O_FOR_ZERO = /^O([A-Z])(\d)([A-Z]{0,3})$/;

function describeChar(ch: string): string {
  const code = ch.codePointAt(0) ?? 0;
  return `U+${code.toString(16).toUpperCase().padStart(4, "0")}`;
}

/**
 * Cleans a typed designation: trims, folds compatibility and full-width forms
 * (Unicode NFKC), folds Cyrillic/Greek look-alike capitals, upper-cases, and
 * removes spaces, hyphens, underscores and dots. Refuses control or invisible
 * characters and anything but A-Z, 0-9 and "/". A leading letter O on a
 * three-character cold-cathode shape ("OA2") is read as zero.
 * The result is at most MAX_DESIGNATION_LENGTH characters.
 */
export function normaliseDesignation(input: string): NormaliseResult {
  if (typeof input !== "string") {
    return { ok: false, error: "empty", message: "No designation was given." };
  }
  if (input.length > MAX_RAW_LENGTH) {
    return {
      ok: false,
      error: "too-long",
      message: `A designation is at most ${MAX_DESIGNATION_LENGTH} characters.`,
    };
  }
  const changes: string[] = [];
  const trimmed = input.trim();
  const folded = trimmed.normalize("NFKC");
  if (folded !== trimmed) changes.push("folded full-width or compatibility characters");

  const hidden = INVISIBLE_OR_CONTROL.exec(folded);
  if (hidden) {
    return {
      ok: false,
      error: "bad-characters",
      message: `The designation contains an invisible or control character (${describeChar(hidden[0])}).`,
    };
  }

  let value = folded.toUpperCase();
  if (value !== folded) changes.push("upper-cased");

  let mapped = "";
  for (const ch of value) mapped += LOOK_ALIKES[ch] ?? ch;
  if (mapped !== value) changes.push("replaced Cyrillic or Greek look-alike letters");
  value = mapped.replace(DASHES, "-");

  const joined = value.replace(SEPARATORS, "");
  if (joined !== value) changes.push("removed spaces, hyphens or dots");
  value = joined;

  if (value.length === 0) {
    return { ok: false, error: "empty", message: "No designation was given." };
  }
  if (!ALLOWED.test(value)) {
    const bad = [...new Set([...value].filter((ch) => !/[A-Z0-9/]/.test(ch)))];
    return {
      ok: false,
      error: "bad-characters",
      message: `Only letters, digits and "/" can appear in a designation; found ${bad
        .slice(0, 5)
        .map((ch) => `"${ch}" (${describeChar(ch)})`)
        .join(", ")}.`,
    };
  }
  if (value.length > MAX_DESIGNATION_LENGTH) {
    return {
      ok: false,
      error: "too-long",
      message: `A designation is at most ${MAX_DESIGNATION_LENGTH} characters; this one has ${value.length}.`,
    };
  }
  const zero = LETTER_O_FOR_ZERO.exec(value);
  if (zero) {
    value = `0${zero[1]}${zero[2]}${zero[3]}`;
    changes.push("read the leading letter O as the digit 0 (cold-cathode numbering)");
  }
  return { ok: true, value, changes };
}

/** Normalised form of a designation, or undefined when it cannot be cleaned. For table keys. */
export function designationKey(input: string): string | undefined {
  const result = normaliseDesignation(input);
  return result.ok ? result.value : undefined;
}

const US_STEM = /^(\d{1,3}[A-Z]{1,2}\d{1,2})[A-Z/]*$/;
const SPECIAL_STEM = /^(\d{4})[A-Z/]*$/;

/**
 * The suffix-free stem of a normalised US designation ("6SN7GTB" -> "6SN7",
 * "5814A" -> "5814"), used to find data for a suffix variant we do not list.
 * Undefined for other schemes, whose letters are not suffixes.
 */
export function designationStem(normalised: string): string | undefined {
  return US_STEM.exec(normalised)?.[1] ?? SPECIAL_STEM.exec(normalised)?.[1];
}
