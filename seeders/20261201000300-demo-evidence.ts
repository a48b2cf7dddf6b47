import { randomUUID } from "node:crypto";
import type { QueryInterface } from "sequelize";
import { decodeDesignation } from "../lib/valves/designation";
import { seedReferenceTable } from "../lib/valves/seed";

type Ctx = { context: QueryInterface };

/**
 * Demo evidence (all invented): each demo factory's construction habits as
 * source-code-confirmed reference tubes on the house bench, a dealer's
 * unconfirmed shelf, and lots from the demo consignors in every review state,
 * among them the Voss estate's 120-valve attic box.
 */

// Invented construction habits per demo factory.
const HABITS: Record<string, Record<string, string>> = {
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
const CODES: Record<string, string> = {
  "Aldergrove Electron Works": "X17",
  "Kestrel Valve Company": "X31",
  "Pellham Radio Tube Corp.": "X46",
  "Vireo Lamp & Valve": "X58",
};

function prng(seed: number) {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

async function userId(qi: QueryInterface, email: string): Promise<string> {
  const [rows] = (await qi.sequelize.query(`SELECT id FROM users WHERE email = :email`, {
    replacements: { email },
  })) as [{ id: string }[], unknown];
  if (!rows[0]) throw new Error(`demo user ${email} missing: run the demo-users seeder first`);
  return rows[0].id;
}

async function makerId(qi: QueryInterface, name: string): Promise<number> {
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

type ItemSpec = {
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

async function insertLot(
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
function tested(
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

export async function up({ context: qi }: Ctx): Promise<void> {
  const rand = prng(20261201);
  const admin = await userId(qi, "priya@house.getterline.test");
  const quill = await userId(qi, "quill@dealer.getterline.test");
  const voss = await userId(qi, "voss-estate@consignor.getterline.test");
  const marrow = await userId(qi, "marrow-creek@consignor.getterline.test");
  const odette = await userId(qi, "odette@consignor.getterline.test");
  const now = new Date();

  // The house bench: tubes whose source codes confirm their factory become reference examples.
  const bench: object[] = [];
  for (const maker of Object.keys(HABITS)) {
    const mid = await makerId(qi, maker);
    for (const type of ["12AX7", "6SN7GT", "EL84"]) {
      for (let k = 0; k < 3; k++) {
        const f = { ...HABITS[maker]! };
        if (k === 2) delete f.markingMethod; // not every feature is visible on every tube
        bench.push({
          id: randomUUID(),
          owner_id: admin,
          designation: type,
          label_brand: k === 0 ? "" : "Tri-County Parts",
          source_code: CODES[maker],
          date_code: `${58 + k}${10 + k * 7}`,
          features: JSON.stringify(f),
          basis: "source-code-confirmed",
          maker_id: mid,
          notes: "House reference bench (demo)",
          client_key: null,
          created_at: now,
          updated_at: now,
        });
      }
    }
  }
  // A dealer's unconfirmed shelf: no source codes printed, construction recorded.
  const shelf = [
    { designation: "12AX7", label: "Fairmont Home Radio", features: { ...HABITS["Pellham Radio Tube Corp."]! } },
    {
      designation: "12AX7",
      label: "Carrow Instruments",
      features: { plateColour: "black", plateSurface: "ribbed", getterShape: "d-shape", getterPosition: "side" },
    },
    { designation: "6SN7GT", label: "Fairmont Home Radio", features: { plateShape: "box", getterShape: "halo" } },
    {
      designation: "EL84",
      label: "",
      features: {
        plateShape: "round",
        plateColour: "bright",
        plateSurface: "finned",
        getterShape: "disc",
        getterPosition: "bottom",
        micaCount: "3",
      },
    },
  ];
  for (const s of shelf) {
    bench.push({
      id: randomUUID(),
      owner_id: quill,
      designation: s.designation,
      label_brand: s.label,
      source_code: null,
      date_code: null,
      features: JSON.stringify(s.features),
      basis: "unconfirmed",
      maker_id: null,
      notes: "",
      client_key: null,
      created_at: now,
      updated_at: now,
    });
  }
  await qi.bulkInsert("shelf_tubes", bench);

  // The Voss estate's attic box: 120 valves, approved.
  const voss120: ItemSpec[] = [
    ...tested(
      rand,
      "12AX7",
      16,
      1600,
      {
        label: "Fairmont Home Radio",
        maker: "Aldergrove Electron Works",
        basis: "source-code-confirmed",
        source: "X17",
        date: "5943",
        features: HABITS["Aldergrove Electron Works"],
        condition: "used",
      },
      true,
      8,
    ),
    ...tested(rand, "12AX7", 8, 1600, {
      label: "Carrow Instruments",
      maker: "Kestrel Valve Company",
      basis: "construction-matched",
      date: "6211",
      features: { plateColour: "black", getterShape: "d-shape" },
      condition: "new-old-stock",
    }),
    ...tested(rand, "6SN7GT", 16, 2600, { label: "Tri-County Parts", condition: "used" }, true, 0),
    ...tested(
      rand,
      "EL84",
      16,
      11300,
      {
        label: "Fairmont Home Radio",
        maker: "Vireo Lamp & Valve",
        basis: "construction-matched",
        features: HABITS["Vireo Lamp & Valve"],
        condition: "used",
      },
      false,
    ),
    ...tested(rand, "12AU7", 12, 2200, { label: "Tri-County Parts", condition: "used" }),
    {
      designation: "12AU7",
      quantity: 4,
      label: "Tri-County Parts",
      condition: "used",
      vacuumLoss: true,
      notes: "White getters: air leak",
    },
    ...tested(rand, "6V6GT", 12, 4100, { label: "Fairmont Home Radio", condition: "used" }, false),
    { designation: "5AR4", quantity: 4, label: "Carrow Instruments", condition: "new-in-box", date: "6634" },
    {
      designation: "6BA6",
      quantity: 20,
      label: "Fairmont Home Radio",
      condition: "used",
      notes: "Radio pulls, untested",
    },
    { designation: "35W4", quantity: 12, label: "", condition: "used", notes: "Untested bundle" },
  ];
  await insertLot(
    qi,
    {
      consignor: voss,
      title: "Attic box: 120 mixed receiving valves",
      admin,
      provenance:
        "Three boxes from a radio amateur's attic, sorted into one lot. Most were tested on his own mutual-conductance tester; the rectifiers and radio tubes were not.",
      origin: "Harlan County",
      tester: "mutual-conductance",
      state: "approved",
      estimate: [60_000, 90_000, 50_000],
    },
    voss120,
  );

  // Marrow Creek Radio & TV: drawer stock, waiting for the house.
  await insertLot(
    qi,
    {
      consignor: marrow,
      title: "Shop drawer: new-in-box small-signal stock",
      provenance: "Closing repair shop; drawers of boxed stock, never installed.",
      origin: "Marrow Creek",
      tester: "untested",
      state: "in-review",
    },
    [
      { designation: "6AU6", quantity: 18, label: "Tri-County Parts", condition: "new-in-box" },
      { designation: "12AT7", quantity: 10, label: "Fairmont Home Radio", condition: "new-in-box", date: "7021" },
      {
        designation: "0A2",
        quantity: 6,
        label: "Carrow Instruments",
        condition: "new-in-box",
        notes: "Regulator tubes",
      },
    ],
  );

  // Odette Lind: power tubes and a mercury-vapour rectifier, still a draft.
  await insertLot(
    qi,
    {
      consignor: odette,
      title: "Broadcast spares: power tubes and rectifiers",
      provenance: "Spares from a retired broadcast engineer's bench, some matched sets.",
      origin: "Lakeside",
      tester: "mutual-conductance",
      state: "draft",
    },
    [
      ...tested(rand, "6L6GC", 8, 6000, { label: "Carrow Instruments", condition: "new-old-stock" }, false),
      {
        designation: "866A",
        quantity: 2,
        label: "",
        condition: "used",
        hazards: ["mercury-vapour"],
        notes: "Mercury-vapour rectifiers",
      },
    ],
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(
    `DELETE FROM lots WHERE consignor_id IN (SELECT id FROM users WHERE email LIKE '%.getterline.test')`,
  );
  await qi.sequelize.query(
    `DELETE FROM shelf_tubes WHERE owner_id IN (SELECT id FROM users WHERE email LIKE '%.getterline.test')`,
  );
}
