// The fake's pure parts: Stripe's bracket form encoding, the fake fee rule, the Luhn check, the signature header.
import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { luhnValid, redactCardParams } from "@/server/stripe-fake/cards";
import { FakeError } from "@/server/stripe-fake/errors";
import { processingFee } from "@/server/stripe-fake/fees";
import { parseForm } from "@/server/stripe-fake/form";
import { signatureHeader } from "@/server/stripe-fake/webhooks";

describe("parseForm", () => {
  it("reads nested hashes, numbered and empty-bracket arrays, and leaves metadata keys alone", () => {
    const p = parseForm(
      "amount=1200&card[number]=4242424242424242&expand[0]=a&expand[1]=b.c&types[]=x&types[]=y&metadata[0]=zero&metadata[lot]=L%2012&note=a+b",
    );
    expect(p).toEqual({
      amount: "1200",
      card: { number: "4242424242424242" },
      expand: ["a", "b.c"],
      types: ["x", "y"],
      metadata: { "0": "zero", lot: "L 12" },
      note: "a b",
    });
  });

  it("decodes what the SDK itself sends", () => {
    // The SDK's encoder keeps brackets literal and percent-encodes the rest (qs-compatible).
    const p = parseForm("metadata[k%20ey]=v%26w&capabilities[transfers][requested]=true");
    expect(p).toEqual({ metadata: { "k ey": "v&w" }, capabilities: { transfers: { requested: "true" } } });
  });

  it("refuses a parameter that is both a value and a hash, and prototype keys", () => {
    expect(() => parseForm("a=1&a[b]=2")).toThrow(FakeError);
    expect(() => parseForm("__proto__[x]=1")).toThrow(FakeError);
    expect(() => parseForm("a=1&a=2")).toThrow(FakeError);
  });
});

describe("fake fee rule (the fake's own: 2.9 % rounded half up + 30 minor units)", () => {
  it.each([
    [10000, 320], // 290 + 30
    [50, 31], // 1.45 → 1, + 30
    [1724, 80], // 49.996 → 50, + 30
    [1000, 59], // 29 + 30
    [5000, 175], // 145 + 30
    [1017, 59], // 29.493 → 29, + 30
  ])("fee on %i is %i", (amount, fee) => {
    expect(processingFee(amount)).toBe(fee);
  });
});

describe("cards", () => {
  it("checks the Luhn digit", () => {
    expect(luhnValid("4242424242424242")).toBe(true);
    expect(luhnValid("4242424242424241")).toBe(false);
    expect(luhnValid("4000002500003155")).toBe(true);
  });

  it("keeps no full number or security code in what the idempotency check fingerprints", () => {
    const r = redactCardParams(parseForm("type=card&card[number]=4000002500003155&card[cvc]=987&card[exp_month]=4"));
    const text = JSON.stringify(r);
    expect(text).not.toContain("4000002500003155");
    expect(text).not.toContain("987");
    expect(text).toContain("3155");
  });
});

describe("signatureHeader", () => {
  it("matches the SDK's own test header and verifies with constructEvent", () => {
    const stripe = new Stripe("sk_test_unit", { telemetry: false });
    const payload = JSON.stringify({ id: "evt_1", object: "event" });
    const t = Math.floor(Date.now() / 1000);
    const ours = signatureHeader(payload, "whsec_unit", t);
    expect(ours).toBe(stripe.webhooks.generateTestHeaderString({ payload, secret: "whsec_unit", timestamp: t }));
    expect(stripe.webhooks.constructEvent(payload, ours, "whsec_unit").id).toBe("evt_1");
    expect(() => stripe.webhooks.constructEvent(payload, ours, "whsec_other")).toThrow();
  });
});
