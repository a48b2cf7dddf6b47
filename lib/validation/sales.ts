import { z } from "zod";
import { lineText, multilineText } from "./text";

/** The house schedules approved lots into a sale (shared by its form and POST /api/sales). */
export const SaleCreateSchema = z
  .object({
    title: lineText().trim().min(3, "Give the sale a title").max(140),
    startsAt: z.iso.datetime({ offset: true, message: "Give a start date and time" }),
    firstCloseAt: z.iso.datetime({ offset: true, message: "Give the first closing time" }),
    gapSeconds: z.number().int().min(10, "At least 10 seconds between closings").max(3600),
    /** Omitted: the late-bid window of the house settings in force. */
    softCloseSeconds: z.number().int().min(30, "At least 30 seconds").max(1800).optional(),
    lots: z
      .array(
        z.object({
          lotId: z.uuid(),
          openingCents: z.number().int().min(100, "Open at $1.00 or more").max(100_000_000),
        }),
      )
      .min(1, "Choose at least one approved lot")
      .max(200)
      .refine((ls) => new Set(ls.map((l) => l.lotId)).size === ls.length, "A lot can be offered once per sale"),
  })
  .refine((s) => Date.parse(s.firstCloseAt) > Date.parse(s.startsAt), {
    message: "The first close must come after the start",
    path: ["firstCloseAt"],
  });
export type SaleCreateInput = z.infer<typeof SaleCreateSchema>;

/** POST /api/sale-lots/:id/bids: a maximum in cents and a key the client keeps for retries. */
export const BidSchema = z.object({
  maxCents: z.number().int("Whole cents only").positive().max(100_000_000, "That is beyond any lot here"),
  idempotencyKey: z.string().trim().min(8).max(80),
});
export type BidInput = z.infer<typeof BidSchema>;

/** POST /api/sale-lots/:id/bids/:bidId/retract (house only). */
export const RetractSchema = z.object({
  reason: multilineText().trim().min(5, "Give the reason for the record").max(500),
});

/** A bid sent over the socket: the lot named in the message. */
export const SocketBidSchema = BidSchema.extend({ saleLotId: z.uuid("No such lot") });
