// POST /api/account/sign-up — open a consignor or dealer account
import { readJson, route } from "@/lib/api/route";
import { signUp } from "@/lib/services/accounts";
import { SignUpSchema } from "@/lib/validation/account";

export const POST = route({ public: true }, async ({ req }) => {
  const input = await readJson(req, SignUpSchema);
  const account = await signUp(input);
  return Response.json({ account }, { status: 201 });
});
