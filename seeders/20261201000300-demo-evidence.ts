import { randomUUID } from "node:crypto";
import type { QueryInterface } from "sequelize";
import { CODES, HABITS, insertLot, makerId, prng, tested, userId, type ItemSpec } from "./support/demo-lots";

type Ctx = { context: QueryInterface };

/**
 * Demo evidence (all invented): each demo factory's construction habits as
 * source-code-confirmed reference tubes on the house bench, a dealer's
 * unconfirmed shelf, and lots from the demo consignors in every review state,
 * among them the Voss estate's 120-valve attic box.
 */

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
