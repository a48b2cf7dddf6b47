// POST /api/want-lists/unsubscribe — stop want-list digests from the link in one, without signing in ({u, t})
import { readJson, route } from "@/lib/api/route";
import { unsubscribeDigest } from "@/lib/services/want-list-matching";
import { UnsubscribeSchema } from "@/lib/validation/want-lists";

export const POST = route({ public: true }, async ({ req }) => {
  const { u, t } = await readJson(req, UnsubscribeSchema, 1024);
  await unsubscribeDigest(u, t);
  return { unsubscribed: true };
});
