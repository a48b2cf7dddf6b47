import { z } from "zod";
import { lineText } from "./text";
import { CLOSENESS } from "../catalogue/want-list";
import { normaliseDesignation } from "../valves/designation/normalise";
import { BASIS_VALUES, CONDITION_VALUES } from "./lots";

/** How many want lists one dealer may keep: enough for any buying plan, few enough to read. */
export const MAX_WANT_LISTS = 100;

export const WantCriteriaSchema = z.object({
  designation: z
    .string()
    .trim()
    .min(1, "Name the type you want")
    .max(40)
    .refine((d) => normaliseDesignation(d).ok, "Not a designation: check it (e.g. 12AX7, ECC83, 6SN7GT)"),
  closeness: z.enum(CLOSENESS).default("exact"),
  minQuantity: z.coerce.number().int().min(1, "At least 1 tube").max(10_000).default(1),
  conditions: z.array(z.enum(CONDITION_VALUES)).max(3).default([]),
  makerBases: z.array(z.enum(BASIS_VALUES)).max(3).default([]),
  noVacuumLoss: z.boolean().default(false),
  maxEstimateCents: z.number().int().min(100).max(100_000_000).nullable().default(null),
});

/** POST /api/want-lists and the form that saves a search. */
export const WantListCreateSchema = z.object({
  name: lineText().trim().min(1, "Give the list a name").max(80),
  criteria: WantCriteriaSchema,
});
export type WantListCreateInput = z.infer<typeof WantListCreateSchema>;

/** PATCH /api/want-lists/:id: pause, resume or rename. */
export const WantListPatchSchema = z
  .object({
    name: z.string().trim().min(1).max(80).optional(),
    paused: z.boolean().optional(),
  })
  .refine((p) => p.name !== undefined || p.paused !== undefined, "Nothing to change");

/** POST /api/want-lists/unsubscribe: the link in a digest, without signing in. */
export const UnsubscribeSchema = z.object({ u: z.uuid(), t: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/) });
