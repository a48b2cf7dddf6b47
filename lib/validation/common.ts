import { z } from "zod";
import { lineText } from "./text";

/** Route params that are UUIDs: a malformed id is a 404, like a missing one. */
export const IdParam = z.object({ id: z.uuid("No such record") });
export const LotItemParams = z.object({ id: z.uuid("No such lot"), itemId: z.uuid("No such item") });

/** The fields sent with a photo upload (multipart), for lot photos and claim evidence alike. */
export const PhotoFieldsSchema = z.object({
  itemId: z.uuid("Choose an item of this lot").nullable(),
  caption: lineText().trim().max(200, "At most 200 characters"),
});
