import { z } from "zod";
import { lineText, multilineText } from "./text";

/**
 * The sizes of the database columns that inputs are written to, so every
 * schema is bounded by what the column holds: an over-long or over-large
 * value is a 400 naming the field, never a database error (500) and never
 * cut short. Kept in step with the migrations.
 */
export const COLUMN_LENGTHS = {
  lot_items: {
    designation_typed: 64,
    designation: 40,
    label_brand: 120,
    maker_name: 120,
    source_code: 16,
    date_code: 16,
    defect: 200,
    notes: 1000,
  },
  shelf_tubes: { designation: 32, label_brand: 120, source_code: 16, date_code: 16, notes: 2000 },
  valve_types: { designation: 32, alias: 32, source: 40 },
} as const;

/** PostgreSQL's INTEGER maximum: the most cents an INTEGER money column holds (2,147,483,647). */
export const INTEGER_MAX = 2_147_483_647;

/** Money in whole cents for an INTEGER column: at least `min`, at most the column's maximum. */
export function centsColumn(min = 0) {
  return z
    .number()
    .int("Whole cents only")
    .min(min, min === 0 ? "Not below zero" : `At least ${min} cents`)
    .max(INTEGER_MAX, `At most ${INTEGER_MAX.toLocaleString("en")} cents`);
}

/** One line of trimmed text, control characters stripped, at most `max` characters (a column's length). */
export function textColumn(max: number) {
  return lineText().trim().max(max, `At most ${max} characters`);
}

/** Multi-line trimmed text (tabs and line breaks kept, other controls stripped), at most `max` characters. */
export function multilineColumn(max: number) {
  return multilineText().trim().max(max, `At most ${max} characters`);
}
