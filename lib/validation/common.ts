import { z } from "zod";

/** Route params that are UUIDs: a malformed id is a 404, like a missing one. */
export const IdParam = z.object({ id: z.uuid("No such record") });
export const LotItemParams = z.object({ id: z.uuid("No such lot"), itemId: z.uuid("No such item") });
