import { randomUUID } from "node:crypto";
import bcrypt from "bcryptjs";
import { Op, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/** The invented demo cast (see README): one password for every demo account. */
export const DEMO_PASSWORD = "valve-demo-2026";

export const DEMO_USERS: { email: string; displayName: string; roles: string[] }[] = [
  { email: "priya@house.getterline.test", displayName: "Priya Castellan (sales desk)", roles: ["admin"] },
  { email: "voss-estate@consignor.getterline.test", displayName: "Estate of Harlan Voss", roles: ["consignor"] },
  { email: "marrow-creek@consignor.getterline.test", displayName: "Marrow Creek Radio & TV", roles: ["consignor"] },
  { email: "odette@consignor.getterline.test", displayName: "Odette Lind", roles: ["consignor"] },
  { email: "bellweather@dealer.getterline.test", displayName: "Bellweather Audio Supply", roles: ["dealer"] },
  { email: "quill@dealer.getterline.test", displayName: "Quill & Cathode", roles: ["dealer"] },
  { email: "northbank@dealer.getterline.test", displayName: "Northbank Valve Traders", roles: ["dealer"] },
  { email: "sablehill@dealer.getterline.test", displayName: "Sable Hill Hi-Fi", roles: ["dealer", "consignor"] },
  { email: "ines@mediator.getterline.test", displayName: "Ines Okafor", roles: ["mediator"] },
  { email: "tomas@mediator.getterline.test", displayName: "Tomas Reyes", roles: ["mediator"] },
];

export async function up({ context: qi }: Ctx): Promise<void> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 11);
  const now = new Date();
  await qi.bulkInsert(
    "users",
    DEMO_USERS.map((u) => ({
      id: randomUUID(),
      email: u.email,
      display_name: u.displayName,
      password_hash: hash,
      roles: qi.sequelize.literal(`ARRAY[${u.roles.map((r) => `'${r}'`).join(",")}]::varchar[]`),
      created_at: now,
      updated_at: now,
    })),
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkDelete("users", { email: { [Op.in]: DEMO_USERS.map((u) => u.email) } });
}
