import { QueryTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Shipping addresses for the invented demo cast: every town, street and postal code is made up. All in one country,
 * so demo invoices price at the house's same-country zone and carry a ship-to block; a dealer can change theirs on
 * the address page to see zone shipping and any tax rule the house configures.
 */
const DEMO_ADDRESSES: { email: string; line1: string; city: string; region: string; postalCode: string }[] = [
  {
    email: "voss-estate@consignor.getterline.test",
    line1: "7 Orrery Lane",
    city: "Fenwick Hollow",
    region: "OH",
    postalCode: "43999",
  },
  {
    email: "marrow-creek@consignor.getterline.test",
    line1: "212 Creekside Road",
    city: "Marrow Creek",
    region: "PA",
    postalCode: "16999",
  },
  {
    email: "odette@consignor.getterline.test",
    line1: "58 Quarry Hill",
    city: "Lindell",
    region: "VT",
    postalCode: "05999",
  },
  {
    email: "bellweather@dealer.getterline.test",
    line1: "1400 Foundry Street, Unit 3",
    city: "Bellweather",
    region: "IL",
    postalCode: "60999",
  },
  {
    email: "quill@dealer.getterline.test",
    line1: "9 Cathode Court",
    city: "Quillmoor",
    region: "OR",
    postalCode: "97999",
  },
  {
    email: "northbank@dealer.getterline.test",
    line1: "31 North Bank Wharf",
    city: "Port Harrow",
    region: "ME",
    postalCode: "04999",
  },
  {
    email: "sablehill@dealer.getterline.test",
    line1: "4 Sable Hill Road",
    city: "Sable Hill",
    region: "CO",
    postalCode: "80999",
  },
];

export async function up({ context: qi }: Ctx): Promise<void> {
  for (const a of DEMO_ADDRESSES) {
    const [user] = await qi.sequelize.query<{ id: string; display_name: string }>(
      `SELECT id, display_name FROM users WHERE email = :email`,
      { replacements: { email: a.email }, type: QueryTypes.SELECT },
    );
    if (!user) continue;
    await qi.sequelize.query(
      `INSERT INTO addresses (user_id, name, line1, city, region, postal_code, country)
       VALUES (:id, :name, :line1, :city, :region, :postalCode, 'US') ON CONFLICT (user_id) DO NOTHING`,
      { replacements: { id: user.id, name: user.display_name.slice(0, 100), ...a } },
    );
  }
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`DELETE FROM addresses WHERE user_id IN (SELECT id FROM users WHERE email IN (:emails))`, {
    replacements: { emails: DEMO_ADDRESSES.map((a) => a.email) },
  });
}
