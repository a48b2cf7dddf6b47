// Demo only: helpers shared by the demo's sale and claim stories.
import type { Viewer } from "../lib/auth/guards";
import type { Role } from "../lib/auth/roles";
import { BLANK_ITEM, type ItemInput } from "../lib/validation/lots";
import { User } from "../models";

/** Wait a while (the demo story paces itself; never used in tests). */
export const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A demo account as a signed-in viewer. */
export async function viewer(email: string): Promise<Viewer> {
  const u = await User.findOne({ where: { email } });
  if (!u) throw new Error(`demo account ${email} missing (run the seeders)`);
  return { id: u.id, email: u.email, name: u.displayName, roles: [...u.roles] as Role[] };
}

/** A lot item with the blank fields filled. */
export const item = (p: Partial<ItemInput>): ItemInput => ({ ...BLANK_ITEM, ...p });
