import { Op, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * The demo maker registry: four invented factories with invented source
 * codes, every row marked demo. No real maker or real registered code.
 */
export const DEMO_MAKERS = [
  {
    name: "Aldergrove Electron Works",
    code: "X17",
    notes: "Demo factory: grey box plates, halo getter on top, three micas",
  },
  { name: "Kestrel Valve Company", code: "X31", notes: "Demo factory: black ribbed plates, D getter at the side" },
  {
    name: "Pellham Radio Tube Corp.",
    code: "X46",
    notes: "Demo factory: grey dimpled plates, square getter on top, two rivets",
  },
  { name: "Vireo Lamp & Valve", code: "X58", notes: "Demo factory: bright finned plates, disc getter at the bottom" },
] as const;

export async function up({ context: qi }: Ctx): Promise<void> {
  const now = new Date();
  for (const m of DEMO_MAKERS) {
    const [rows] = (await qi.sequelize.query(
      `INSERT INTO makers (name, is_demo, notes, created_at, updated_at) VALUES (:name, true, :notes, :now, :now)
       ON CONFLICT (name) DO UPDATE SET notes = EXCLUDED.notes RETURNING id`,
      { replacements: { name: m.name, notes: m.notes, now } },
    )) as [{ id: number }[], unknown];
    await qi.sequelize.query(
      `INSERT INTO maker_codes (code, maker_id, is_demo, notes, created_at, updated_at) VALUES (:code, :id, true, 'Invented demo code', :now, :now)
       ON CONFLICT (code) DO NOTHING`,
      { replacements: { code: m.code, id: rows[0]!.id, now } },
    );
  }
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkDelete("makers", { name: { [Op.in]: DEMO_MAKERS.map((m) => m.name) } });
}
