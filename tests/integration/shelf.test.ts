import { describe, expect, it } from "vitest";
import { POST as attributionRoute } from "../../app/api/valves/attribution/route";
import { addShelfTube, listShelf, shelfTube } from "../../lib/services/shelf";
import { applyRegistryImport } from "../../lib/services/makers";
import { makeUser, noParams, request, sessionCookie, viewerOf } from "../support/factories";

// Demo data: invented makers and codes; the checks are on the mechanics (label ≠ maker [CTP]; high confidence
// only on several independent matching sub-assemblies [CTP]; confirmed tubes become references [SUG]).
const HABIT = {
  plateShape: "flat",
  plateColour: "grey",
  plateSurface: "dimpled",
  getterShape: "square",
  getterPosition: "top",
  micaCount: "2",
  micaOutline: "shaped",
};

describe("the unconfirmed shelf", () => {
  it("confirms by source code, learns from it, and proposes matching unconfirmed tubes", async () => {
    await applyRegistryImport("code,maker_name,is_demo,notes\nX46,Pellham Radio Tube Corp.,true,demo\n");
    const dealer = viewerOf(await makeUser(["dealer"]));

    const waiting = await addShelfTube(dealer, {
      designation: "12ax7",
      labelBrand: "Fairmont Home Radio",
      sourceCode: null,
      dateCode: null,
      features: HABIT,
      notes: "",
      clientKey: "k-waiting-1",
    });
    expect(waiting.basis).toBe("unconfirmed");
    expect(waiting.designation).toBe("12AX7");
    let shelf = await listShelf(dealer);
    expect(shelf.waiting.map((t) => t.id)).toContain(waiting.id);
    expect(shelf.proposed).toHaveLength(0);

    // A retried request with the same client key adds nothing.
    await addShelfTube(dealer, {
      designation: "12AX7",
      labelBrand: "Fairmont Home Radio",
      sourceCode: null,
      dateCode: null,
      features: HABIT,
      notes: "",
      clientKey: "k-waiting-1",
    });
    expect((await listShelf(dealer)).waiting).toHaveLength(1);

    const confirmed = await addShelfTube(dealer, {
      designation: "ECC83",
      labelBrand: "Tri-County Parts",
      sourceCode: "X46-5943",
      dateCode: null,
      features: HABIT,
      notes: "",
      clientKey: "k-confirmed-1",
    });
    expect(confirmed).toMatchObject({
      basis: "source-code-confirmed",
      makerName: "Pellham Radio Tube Corp.",
      sourceCode: "X46",
      dateCode: "5943",
    });

    shelf = await listShelf(dealer);
    expect(shelf.proposed.map((t) => t.id)).toEqual([waiting.id]);
    expect(shelf.proposed[0]!.best).toMatchObject({ makerName: "Pellham Radio Tube Corp.", confidence: "high" });

    const detail = await shelfTube(dealer, waiting.id);
    expect(detail.candidates[0]!.conflicting).toEqual([]);
  });

  it("ranks makers over the API and answers bad input with 400", async () => {
    const dealer = await makeUser(["dealer"]);
    const cookie = await sessionCookie(dealer);
    const ok = await attributionRoute(
      request("/api/valves/attribution", {
        json: { designation: "12AX7", features: { ...HABIT, plateColour: "black" } },
        headers: { cookie },
      }),
      noParams,
    );
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { candidates: { makerName: string; conflicting: string[] }[] };
    const top = body.candidates[0]!;
    expect(top.makerName).toBe("Pellham Radio Tube Corp.");
    expect(top.conflicting).toContain("plateColour");

    for (const bad of [
      { features: "grey" },
      { features: { plateColour: { deep: 1 } } },
      { features: Object.fromEntries(Array.from({ length: 40 }, (_, i) => [`f${i}`, "x"])) },
    ]) {
      const r = await attributionRoute(
        request("/api/valves/attribution", { json: bad, headers: { cookie } }),
        noParams,
      );
      expect(r.status).toBe(400);
    }
  });
});
