// POST /api/account/password-reset — e-mail a reset link (same answer whether or not the account exists)
import { readJson, route } from "@/lib/api/route";
import { requestPasswordReset } from "@/lib/services/accounts";
import { ResetRequestSchema } from "@/lib/validation/account";

export const POST = route({ public: true }, async ({ req }) => {
  const { email } = await readJson(req, ResetRequestSchema);
  await requestPasswordReset(email);
  return Response.json({ sent: true }, { status: 202 });
});
