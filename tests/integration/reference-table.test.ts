// One source of truth: a house correction to valve_types reaches decoding,
// grading against nominal, the lot summary and intake at once.
import { describe, expect, it } from "vitest";
import { gradeAgainstNominal } from "../../lib/disputes/weigh";
import {
  addReferenceType,
  exportReferenceCsv,
  importReferenceCsv,
  setReferenceRetired,
} from "../../lib/services/reference-curation";
import { summaryFor } from "../../lib/services/lot-summary";
import { addItem, createLot, getLot } from "../../lib/services/lots";
import { currentReferenceTable } from "../../lib/services/reference-table";
import { editReferenceType, lookupType } from "../../lib/services/valve-types";
import { db } from "../../models";
import { itemInput, makeUser, viewerOf } from "../support/factories";

const details = {
  title: "Service-bench drawer",
  provenance: "Closed repair shop",
  shippingOrigin: "Marrow Creek",
  testerKind: "mutual-conductance" as const,
  testerNotes: "",
};

describe("the house's reference table is the one source of truth", () => {
  it("a house edit of a nominal Gm changes the grading against nominal, the readings chart and the decode at once", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(consignor), details);
    // 6AU6 at 250 V, g2 150 V, Rk 68 Ω: Gm 5,200 µmho [REG MEM] (seed row).
    const item = await addItem(
      viewerOf(consignor),
      lot.id,
      itemInput({ designation: "6AU6", quantity: 1, readings: [{ tubeNo: 1, measure: "gm", sections: [5200] }] }),
    );
    const before = await summaryFor([item]);
    expect(before.chart[0]!.percentOfNominal).toBe(100);
    expect(gradeAgainstNominal(await currentReferenceTable(), "6AU6", item.readings)[0]!.percentOfNominal).toBe(100);

    const ref = (await lookupType("6AU6")).reference!;
    await editReferenceType(admin.id, "6AU6", ref.revision, {
      reason: "Integration test: a house correction",
      source: "REG MEM",
      heaterVolts: 6.3,
      heaterAmps: 0.3,
      introducedYear: null,
      plateVolts: 250,
      gridVolts: null,
      screenVolts: 150,
      mu: null,
      gmMicromho: 6500,
      plateCurrentMa: 10.6,
      rpOhms: null,
      note: "",
    });
    const after = await summaryFor([item]);
    expect(after.chart[0]!.percentOfNominal).toBe(80); // 5,200 / 6,500
    expect(gradeAgainstNominal(await currentReferenceTable(), "6AU6", item.readings)[0]!.percentOfNominal).toBe(80);
    expect((await lookupType("6au6")).reference).toMatchObject({
      revision: ref.revision + 1,
      characteristics: { gmMicromho: 6500 },
    });
  });

  it("re-reads the table when another instance changes a row (revision counter bumped by the trigger)", async () => {
    const first = await currentReferenceTable();
    expect(await currentReferenceTable()).toBe(first); // cached while nothing changes
    // Another instance writes straight to the table.
    await db().query(
      `UPDATE valve_types SET data = jsonb_set(data, '{note}', '"changed elsewhere"') WHERE designation = '6BA6'`,
    );
    const next = await currentReferenceTable();
    expect(next).not.toBe(first);
    expect(Number(next.revision)).toBeGreaterThan(Number(first.revision));
    expect(next.rows.find((r) => r.designation === "6BA6")?.note).toBe("changed elsewhere");
  });

  it("a type the house adds stops being flagged in a consignor's lot; retiring it brings the flag back", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(consignor), details);
    // KT61 follows neither numbering scheme [LS53, PE]: only a listed name is accepted.
    await addItem(viewerOf(consignor), lot.id, itemInput({ designation: "KT61", quantity: 2 }));
    const flagged = (await getLot(viewerOf(consignor), lot.id)).items[0]!;
    expect(flagged.designationKnown).toBe(false);
    expect((await summaryFor([flagged])).summary.unknownDesignations.map((u) => u.normalised)).toEqual(["KT61"]);

    await addReferenceType(admin.id, {
      designation: "KT61",
      aliases: "",
      kind: "beam-tetrode",
      base: "octal",
      coldCathode: false,
      heaterVolts: null,
      heaterAmps: null,
      source: "MEM",
      note: "",
      reason: "Seen in a consignment; figures to follow",
    });
    const known = (await getLot(viewerOf(consignor), lot.id)).items[0]!;
    expect(known.designationKnown).toBe(true);
    expect((await summaryFor([known])).summary.unknownDesignations).toEqual([]);
    expect(await lookupType("KT61")).toMatchObject({ onFile: true, reference: { designation: "KT61", source: "MEM" } });

    await setReferenceRetired(admin.id, "KT61", true, "Integration test: retired");
    expect((await getLot(viewerOf(consignor), lot.id)).items[0]!.designationKnown).toBe(false);
  });

  it("imports CSV all or nothing with line numbers, and the same file twice changes nothing", async () => {
    const admin = await makeUser(["admin"]);
    const header = "designation,aliases,kind,base,heater_volts,heater_amps,source,note";
    const bad = `${header}\n6BQ5X9,,pentode,noval,6.3,0.3,REG MEM,\nZZTOP,,not-a-kind,noval,,,MEM,\n`;
    const refused = await importReferenceCsv(admin.id, bad, true, "Integration test import");
    expect(refused.applied).toBe(false);
    expect(refused.errors.map((e) => e.line)).toEqual([3]);
    expect((await lookupType("6BQ5X9").catch(() => null))?.onFile ?? false).toBe(false);

    const good = `${header}\nKT63,,beam-tetrode,octal,,,MEM,Added by import\n6AU6,EF94;6AU6A,pentode,miniature-7-pin,6.3,0.3,REG MEM,\n`;
    const preview = await importReferenceCsv(admin.id, good, false, "Integration test import");
    expect(preview.lines.map((l) => [l.designation, l.action])).toEqual([
      ["KT63", "add"],
      ["6AU6", "unchanged"],
    ]); // figures columns left out: kept
    const applied = await importReferenceCsv(admin.id, good, true, "Integration test import");
    expect(applied.applied).toBe(true);
    const again = await importReferenceCsv(admin.id, good, true, "Integration test import");
    expect(again.lines.every((l) => l.action === "unchanged")).toBe(true);

    const csv = await exportReferenceCsv();
    const roundTrip = await importReferenceCsv(admin.id, csv, false, "Integration test round trip");
    expect(roundTrip.errors).toEqual([]);
    expect(roundTrip.lines.filter((l) => l.action !== "unchanged")).toEqual([]);
  });
});
