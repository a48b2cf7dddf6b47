/** Typed access to `dispute_messages`: a claim's conversation (rows are immutable). */
import type { Transaction } from "sequelize";
import type { CaseRole } from "../../../disputes/parties";
import { exec, select } from "./query";

/** One row of `dispute_messages`. */
export type DisputeMessageRow = {
  id: string;
  dispute_id: string;
  author_id: string | null;
  author_role: CaseRole;
  body: string;
  client_key: string | null;
  created_at: Date;
};

/** A message with its author's name, for reading. */
export type MessageViewRow = Pick<DisputeMessageRow, "id" | "author_role" | "body" | "created_at"> & {
  author_name: string | null;
};

/** Adds a message. */
export async function insertMessage(
  m: Pick<DisputeMessageRow, "id" | "dispute_id" | "author_id" | "author_role" | "body" | "client_key">,
  t: Transaction,
): Promise<void> {
  await exec(
    `INSERT INTO dispute_messages (id, dispute_id, author_id, author_role, body, client_key, created_at) VALUES (:id, :disputeId, :me, :role, :body, :k, now())`,
    { id: m.id, disputeId: m.dispute_id, me: m.author_id, role: m.author_role, body: m.body, k: m.client_key },
    t,
  );
}

/** The message an author already posted with this client key, if any. */
export async function findMessageByKey(
  disputeId: string,
  authorId: string,
  clientKey: string,
  t: Transaction,
): Promise<{ id: string } | undefined> {
  const [seen] = await select<{ id: string }>(
    `SELECT id FROM dispute_messages WHERE dispute_id = :disputeId AND author_id = :me AND client_key = :k`,
    { disputeId, me: authorId, k: clientKey },
    t,
  );
  return seen;
}

/** A claim's conversation, oldest first. */
export async function messagesOf(disputeId: string): Promise<MessageViewRow[]> {
  return select<MessageViewRow>(
    `SELECT m.id, m.author_role, u.display_name AS author_name, m.body, m.created_at FROM dispute_messages m LEFT JOIN users u ON u.id = m.author_id
      WHERE m.dispute_id = :id ORDER BY m.created_at, m.id`,
    { id: disputeId },
  );
}
