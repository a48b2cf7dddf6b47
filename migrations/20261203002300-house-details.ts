import type { QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * The house's own business details join the settings (trading name, postal address, paperwork e-mail). Versions kept
 * before have none, and the schema requires them, so each gets the details the exchange starts with: invented ones,
 * copied here rather than imported, so this migration writes the same whatever the code's defaults become later.
 * A version that already carries details (one written by newer code) is left alone. Down takes the section off again.
 */
const FIRST_DETAILS = {
  tradingName: "Getterline Exchange",
  address: {
    line1: "Flashfield Works, Unit 4",
    line2: "27 Anode Street",
    city: "Glowmere",
    region: "",
    postalCode: "GM4 7EX",
    country: "GB",
  },
  paperworkEmail: "paperwork@house.getterline.test",
};

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(
    `UPDATE house_settings_versions SET settings = jsonb_set(settings, '{house}', CAST(:details AS jsonb), true)
      WHERE settings->'house' IS NULL`,
    { replacements: { details: JSON.stringify(FIRST_DETAILS) } },
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`UPDATE house_settings_versions SET settings = settings - 'house'`);
}
