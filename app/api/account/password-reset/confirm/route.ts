// POST /api/account/password-reset/confirm — set a new password from a reset link
import { readJson, route } from "@/lib/api/route";
import { confirmPasswordReset } from "@/lib/services/accounts";
import { ResetConfirmSchema } from "@/lib/validation/account";

export const POST = route({ public: true }, async ({ req }) => {
  await confirmPasswordReset(await readJson(req, ResetConfirmSchema));
  return { reset: true };
});
