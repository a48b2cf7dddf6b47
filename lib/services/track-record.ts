import { QueryTypes } from "sequelize";
import { needsExtraReview, trackRecord, type TrackRecord } from "../disputes/rules";
import { db } from "../../models";
import { currentSettings } from "./house-settings";

/** A consignor's attribution record from sales and decided claims. */
export async function consignorRecord(consignorId: string): Promise<TrackRecord> {
  const [r] = await db().query<{
    sold: string | null;
    disputed: string | null;
    upheld: string | null;
    misattributed: string;
  }>(
    `SELECT (SELECT SUM(tube_count) FROM invoices WHERE consignor_id = :c AND state IN ('paid-held','shipped','delivered','disputed','released','refunded')) AS sold,
            (SELECT SUM(di.tubes) FROM dispute_items di JOIN disputes d ON d.id = di.dispute_id WHERE d.consignor_id = :c) AS disputed,
            (SELECT SUM(upheld_tubes) FROM disputes WHERE consignor_id = :c AND outcome IN ('partial-refund','refund-on-return')) AS upheld,
            (SELECT COUNT(*) FROM disputes WHERE consignor_id = :c AND reason = 'maker-misattributed' AND outcome IN ('partial-refund','refund-on-return')) AS misattributed`,
    { replacements: { c: consignorId }, type: QueryTypes.SELECT },
  );
  return trackRecord({
    tubesSold: Number(r?.sold ?? 0),
    tubesDisputed: Number(r?.disputed ?? 0),
    tubesUpheld: Number(r?.upheld ?? 0),
    upheldMisattributionClaims: Number(r?.misattributed ?? 0),
  });
}

/**
 * After an upheld misattribution, the consignor's lots awaiting review go to extra review (new ones are flagged on
 * submission). The threshold is the current settings version's `claims.extraReviewAfterUpheld`: review is the house's
 * work now, not a sale's frozen terms.
 */
export async function flagExtraReview(consignorId: string): Promise<void> {
  const [record, { settings }] = await Promise.all([consignorRecord(consignorId), currentSettings()]);
  if (!needsExtraReview(record.upheldMisattributionClaims, settings.claims.extraReviewAfterUpheld)) return;
  await db().query(
    `UPDATE lots SET extra_review = true, updated_at = now() WHERE consignor_id = :c AND state IN ('draft','in-review','needs-changes') AND extra_review = false`,
    { replacements: { c: consignorId } },
  );
}

/** The record of the consignor of a lot, for the dealers reading it. */
export async function recordForLot(lotId: string): Promise<TrackRecord | null> {
  const [row] = await db().query<{ consignor_id: string }>(`SELECT consignor_id FROM lots WHERE id = :lotId`, {
    replacements: { lotId },
    type: QueryTypes.SELECT,
  });
  return row ? consignorRecord(row.consignor_id) : null;
}
