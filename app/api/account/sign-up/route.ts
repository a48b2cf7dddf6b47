// POST /api/account/sign-up — open a consignor or dealer account that waits for its e-mailed link (202, the same answer for a known address)
import { readJson, route } from "@/lib/api/route";
import { signUp } from "@/lib/services/sign-up";
import { SignUpSchema } from "@/lib/validation/account";

export const POST = route({ public: true }, async ({ req }) => {
  const input = await readJson(req, SignUpSchema);
  return Response.json(await signUp(input), { status: 202 });
});
