/**
 * Keyset paging for the catalogue: a cursor names the last lot shown and its sort key, so the next page starts
 * strictly after it whatever is inserted meanwhile (nothing repeats, nothing is skipped). Opaque to clients
 * (base64url JSON) and checked when read back. Pure.
 */
import { z } from "zod";

export const SORTS = ["relevance", "closing", "newest", "estimate"] as const;
export type CatalogueSort = (typeof SORTS)[number];

const CursorSchema = z.object({
  s: z.enum(SORTS),
  /** The sort key of the last lot shown: a number (rank, epoch ms, cents) or null where the lot has none. */
  k: z
    .array(z.union([z.number().finite(), z.null()]))
    .min(1)
    .max(3),
  id: z.uuid(),
});
export type Cursor = z.infer<typeof CursorSchema>;

export function encodeCursor(c: Cursor): string {
  return Buffer.from(JSON.stringify(c), "utf8").toString("base64url");
}

/** The cursor, or null when it is not one of ours (malformed, or for another sort). */
export function decodeCursor(text: string, sort: CatalogueSort): Cursor | null {
  if (text.length > 400 || !/^[A-Za-z0-9_-]+$/.test(text)) return null;
  try {
    const parsed = CursorSchema.safeParse(JSON.parse(Buffer.from(text, "base64url").toString("utf8")));
    return parsed.success && parsed.data.s === sort ? parsed.data : null;
  } catch {
    return null;
  }
}
