// Helpers and invented data for the demo-evidence seeder (this folder is not scanned for seeders).
import { randomUUID } from "node:crypto";
import type { QueryInterface } from "sequelize";
import { decodeDesignation } from "../../lib/valves/designation";
import { seedReferenceTable } from "../../lib/valves/seed";

// Invented construction habits per demo factory.
export const HABITS: Record<string, Record<string, string>> = {
  "Aldergrove Electron Works": {
    plateShape: "box",
    plateColour: "grey",
    plateSurface: "smooth",
    getterShape: "halo",
    getterPosition: "top",
    flashPlace: "dome",
    micaCount: "3",
    micaOutline: "plain",
    supportRodFinish: "bright-nickel",
    markingMethod: "silk-screen",
  },
  "Kestrel Valve Company": {
    plateShape: "flat",
    plateColour: "black",
    plateSurface: "ribbed",
    getterShape: "d-shape",
    getterPosition: "side",
    flashPlace: "side",
    micaCount: "2",
    micaOutline: "notched",
    supportRodFinish: "dark-iron",
    markingMethod: "stamped",
  },
  "Pellham Radio Tube Corp.": {
    plateShape: "flat",
    plateColour: "grey",
    plateSurface: "dimpled",
    getterShape: "square",
    getterPosition: "top",
    flashPlace: "dome",
    micaCount: "2",
    micaOutline: "shaped",
    plateFastening: "rivets",
    plateFastenerCount: "2",
    markingMethod: "silk-screen",
  },
  "Vireo Lamp & Valve": {
    plateShape: "round",
    plateColour: "bright",
    plateSurface: "finned",
    getterShape: "disc",
    getterPosition: "bottom",
    flashPlace: "side",
    micaCount: "3",
    micaOutline: "shaped",
    supportRodFinish: "copper-coloured",
    markingMethod: "etched",
  },
};
export const CODES: Record<string, string> = {
  "Aldergrove Electron Works": "X17",
  "Kestrel Valve Company": "X31",
  "Pellham Radio Tube Corp.": "X46",
  "Vireo Lamp & Valve": "X58",
};

export function prng(seed: number) {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

export async function userId(qi: QueryInterface, email: string): Promise<string> {
  const [rows] = (await qi.sequelize.query(`SELECT id FROM users WHERE email = :email`, {
    replacements: { email },
  })) as [{ id: string }[], unknown];
  if (!rows[0]) throw new Error(`demo user ${email} missing: run the demo-users seeder first`);
  return rows[0].id;
}

export async function makerId(qi: QueryInterface, name: string): Promise<number> {
  const [rows] = (await qi.sequelize.query(`SELECT id FROM makers WHERE name = :name`, { replacements: { name } })) as [
    { id: number }[],
    unknown,
  ];
  return rows[0]!.id;
}

// Demo items are read against the seed rows, which the migrations have just loaded into valve_types.
const norm = (d: string) => {
  const r = decodeDesignation(seedReferenceTable(), d);
  return { designation: r.ok ? r.normalised : d, known: r.ok };
};

export type ItemSpec = {
  designation: string;
  quantity: number;
  label: string;
  maker?: string;
  basis?: string;
  source?: string;
  date?: string;
  features?: Record<string, string>;
  condition: string;
  vacuumLoss?: boolean;
  readings?: object[];
  hazards?: string[];
  notes?: string;
};

export async function insertLot(
  qi: QueryInterface,
  lot: {
    consignor: string;
    title: string;
    provenance: string;
    origin: string;
    tester: string;
    state: string;
    admin?: string;
    estimate?: [number, number, number];
  },
  items: ItemSpec[],
) {
  const now = new Date();
  const id = randomUUID();
  const approved = lot.state === "approved";
  await qi.bulkInsert("lots", [
    {
      id,
      consignor_id: lot.consignor,
      title: lot.title,
      provenance: lot.provenance,
      shipping_origin: lot.origin,
      tester_kind: lot.tester,
      tester_notes: "",
      state: lot.state,
      estimate_low_cents: lot.estimate?.[0] ?? null,
      estimate_high_cents: lot.estimate?.[1] ?? null,
      reserve_cents: lot.estimate?.[2] ?? null,
      reserve_agreed_at: approved ? now : null,
      submitted_at: lot.state === "draft" ? null : now,
      approved_at: approved ? now : null,
      approved_by: approved ? lot.admin : null,
      extra_review: false,
      created_at: now,
      updated_at: now,
    },
  ]);
  await qi.bulkInsert(
    "lot_items",
    items.map((it, i) => {
      const n = norm(it.designation);
      return {
        id: randomUUID(),
        lot_id: id,
        position: i + 1,
        designation_typed: it.designation,
        designation: n.designation,
        designation_known: n.known,
        quantity: it.quantity,
        label_brand: it.label,
        maker_name: it.maker ?? null,
        maker_basis: it.basis ?? "unconfirmed",
        source_code: it.source ?? null,
        date_code: it.date ?? null,
        features: JSON.stringify(it.features ?? {}),
        condition: it.condition,
        vacuum_loss: it.vacuumLoss ?? false,
        defects: qi.sequelize.literal("ARRAY[]::varchar[]"),
        hazards: qi.sequelize.literal(`ARRAY[${(it.hazards ?? []).map((h) => `'${h}'`).join(",")}]::varchar[]`),
        readings: JSON.stringify(it.readings ?? []),
        notes: it.notes ?? "",
        import_key: null,
        created_at: now,
        updated_at: now,
      };
    }),
  );
  const events = [{ kind: "created", actor: lot.consignor, comment: "" }];
  if (lot.state !== "draft") events.push({ kind: "submitted", actor: lot.consignor, comment: "" });
  if (approved)
    events.push({
      kind: "approved",
      actor: lot.admin!,
      comment: "Evidence reads clearly; estimate from the house's judgement while comparables build up.",
    });
  await qi.bulkInsert(
    "lot_events",
    events.map((e, i) => ({
      lot_id: id,
      actor_id: e.actor,
      kind: e.kind,
      comment: e.comment,
      details: "{}",
      created_at: new Date(now.getTime() + i),
    })),
  );
  return id;
}

/** One tested tube per item: Gm readings around the chart value, seeded. */
export function tested(
  rand: () => number,
  designation: string,
  count: number,
  chart: number,
  base: Omit<ItemSpec, "designation" | "quantity" | "readings">,
  dual = true,
  failEvery = 0,
): ItemSpec[] {
  return Array.from({ length: count }, (_, i) => {
    const a = Math.round(chart * (0.7 + rand() * 0.5));
    const b = Math.round(a * (0.92 + rand() * 0.16));
    const shorts = failEvery > 0 && i % failEvery === failEvery - 1;
    return {
      ...base,
      designation,
      quantity: 1,
      readings: [
        {
          tubeNo: 1,
          measure: "gm",
          sections: dual ? [a, b] : [a],
          chartNewValue: chart,
          ...(shorts ? { shorts: true } : {}),
        },
      ],
    };
  });
}
