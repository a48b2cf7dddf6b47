/** Typed access to `dispute_evidence`: a claim's photos (rows are immutable; files live in object storage). */
import type { CaseRole } from "../../../disputes/parties";
import { exec, select } from "./query";

/** One row of `dispute_evidence`. */
export type DisputeEvidenceRow = {
  id: string;
  dispute_id: string;
  author_id: string;
  author_role: CaseRole;
  lot_item_id: string | null;
  caption: string;
  full_key: string;
  thumb_key: string;
  width: number;
  height: number;
  sha256: string;
  created_at: Date;
};

/** A photo as the case page lists it. */
export type EvidenceViewRow = Pick<
  DisputeEvidenceRow,
  "id" | "author_role" | "lot_item_id" | "caption" | "width" | "height" | "created_at"
>;

/** The photo with these bytes already on the claim, if any. */
export async function findEvidenceBySha(disputeId: string, sha: string): Promise<{ id: string } | undefined> {
  const [seen] = await select<{ id: string }>(
    `SELECT id FROM dispute_evidence WHERE dispute_id = :disputeId AND sha256 = :sha`,
    { disputeId, sha },
  );
  return seen;
}

/** Adds a photo. */
export async function insertEvidence(e: Omit<DisputeEvidenceRow, "created_at">): Promise<void> {
  await exec(
    `INSERT INTO dispute_evidence (id, dispute_id, author_id, author_role, lot_item_id, caption, full_key, thumb_key, width, height, sha256, created_at)
     VALUES (:id, :disputeId, :me, :role, :itemId, :caption, :full, :thumb, :w, :h, :sha, now())`,
    {
      id: e.id,
      disputeId: e.dispute_id,
      me: e.author_id,
      role: e.author_role,
      itemId: e.lot_item_id,
      caption: e.caption,
      full: e.full_key,
      thumb: e.thumb_key,
      w: e.width,
      h: e.height,
      sha: e.sha256,
    },
  );
}

/** Where a photo's files are kept, and its claim. */
export async function findEvidenceFiles(
  evidenceId: string,
): Promise<Pick<DisputeEvidenceRow, "dispute_id" | "full_key" | "thumb_key"> | undefined> {
  const [e] = await select<Pick<DisputeEvidenceRow, "dispute_id" | "full_key" | "thumb_key">>(
    `SELECT dispute_id, full_key, thumb_key FROM dispute_evidence WHERE id = :evidenceId`,
    { evidenceId },
  );
  return e;
}

/** A claim's photos, oldest first. */
export async function evidenceOf(disputeId: string): Promise<EvidenceViewRow[]> {
  return select<EvidenceViewRow>(
    `SELECT id, author_role, lot_item_id, caption, width, height, created_at FROM dispute_evidence WHERE dispute_id = :id ORDER BY created_at`,
    { id: disputeId },
  );
}
