import { z } from "zod";

/**
 * Characters no person types into a title, a note or a message, stripped at the zod boundary:
 * - NUL and the other C0 controls U+0000–U+001F (tab and line feed are kept in multi-line text; a carriage
 *   return becomes a line feed there), DEL U+007F and the C1 controls U+0080–U+009F [UNI-23];
 * - the bidirectional embeddings and overrides U+202A–U+202E and isolates U+2066–U+2069, which reorder how the
 *   rest of a line is shown (a name or a figure could read backwards) [UAX-9 §2.2–2.4];
 * - the line and paragraph separators U+2028–U+2029 in one-line text, the byte-order mark / zero-width no-break
 *   space U+FEFF, the interlinear annotation marks U+FFF9–U+FFFB and the noncharacters U+FFFE–U+FFFF;
 * - lone surrogate halves (a JSON "\ud800" that is no character at all).
 * Ordinary letters of every script, emoji (with their zero-width joiners) and the implicit marks LRM/RLM stay.
 */
const ALWAYS =
  "\\u0000-\\u0008\\u000B\\u000C\\u000E-\\u001F\\u007F-\\u009F\\u202A-\\u202E\\u2066-\\u2069\\uFEFF\\uFFF9-\\uFFFB\\uFFFE\\uFFFF";
const LONE_SURROGATE = "[\\uD800-\\uDBFF](?![\\uDC00-\\uDFFF])|(?<![\\uD800-\\uDBFF])[\\uDC00-\\uDFFF]";
const MULTI_LINE = new RegExp(`[${ALWAYS}]|${LONE_SURROGATE}`, "g");
const ONE_LINE = new RegExp(`[${ALWAYS}\\t\\n\\u2028\\u2029]|${LONE_SURROGATE}`, "g");

/** One-line text (a title, a name, a carrier): every control and separator goes; a tab or line break becomes a space. */
export function cleanLine(s: string): string {
  return s.replace(/[\t\r\n\u2028\u2029]+/g, " ").replace(ONE_LINE, "");
}

/** Multi-line text (a description, a note, a message): tabs and line feeds stay, CR LF and CR become LF. */
export function cleanMultiline(s: string): string {
  return s.replace(/\r\n?|[\u2028\u2029]/g, "\n").replace(MULTI_LINE, "");
}

/** A zod string cleaned as one line; chain `.trim().min().max()` as on any string. */
export const lineText = () => z.string().overwrite(cleanLine);

/** A zod string cleaned as multi-line text. */
export const multilineText = () => z.string().overwrite(cleanMultiline);
