/** A claim's conversation: messages that cannot be edited or deleted; the consignor's first one is their answer. */
import { randomUUID } from "node:crypto";
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import type { DisputeMessageInput } from "../../validation/disputes";
import { db } from "../../../models";
import { mail, notice } from "./mail";
import { loadCase, requireMessageWriter } from "./permissions";
import { recordAnswer, touchDispute } from "./tables/disputes";
import { findMessageByKey, insertMessage } from "./tables/dispute-messages";
import { answeredToBuyer, casePath, messageNotice } from "./templates";

/**
 * Post to a case's conversation. The consignor's first message is their
 * answer (with a stance); the mediator posts once the case is theirs.
 * Messages cannot be edited or deleted; a retry with the same key posts once.
 */
export async function postMessage(
  viewer: Viewer,
  disputeId: string,
  input: DisputeMessageInput,
): Promise<{ id: string }> {
  const out = await db().transaction(async (t) => {
    const { d, role } = await loadCase(viewer, disputeId, t, true);
    requireMessageWriter(d, role, viewer);
    if (input.clientKey) {
      const seen = await findMessageByKey(disputeId, viewer.id, input.clientKey, t);
      if (seen) return { id: seen.id, answered: false, d };
    }
    const answering = role === "consignor" && !d.answered_at;
    if (answering && !input.stance)
      throw new ApiError("validation_failed", "Say whether you accept or contest the claim", {
        stance: "Choose your answer",
      });
    const id = randomUUID();
    await insertMessage(
      {
        id,
        dispute_id: disputeId,
        author_id: viewer.id,
        author_role: role,
        body: input.body,
        client_key: input.clientKey ?? null,
      },
      t,
    );
    if (answering) await recordAnswer(disputeId, input.stance, t);
    else await touchDispute(disputeId, t);
    return { id, answered: answering, d };
  });
  const d = out.d;
  const others = [d.buyer_id, d.consignor_id, d.mediator_id].filter((u): u is string => Boolean(u) && u !== viewer.id);
  for (const u of others) await notice(u, messageNotice(d.number, out.answered), casePath(d.id));
  if (out.answered && input.stance)
    await mail(d.buyer_id, answeredToBuyer({ id: d.id, number: d.number, stance: input.stance }));
  return { id: out.id };
}
