// POST /api/account/confirm-email — confirm a new account's address from the link e-mailed at sign-up
import { readJson, route } from "@/lib/api/route";
import { confirmEmail } from "@/lib/services/sign-up";
import { ConfirmEmailSchema } from "@/lib/validation/account";

export const POST = route({ public: true }, async ({ req }) => {
  const { token } = await readJson(req, ConfirmEmailSchema);
  return confirmEmail(token);
});
