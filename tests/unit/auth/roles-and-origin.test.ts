import { describe, expect, it } from "vitest";
import { ApiError, ERROR_STATUS, fieldsFromIssues } from "../../../lib/api/errors";
import { allowedOriginsFor, isCrossSite } from "../../../lib/auth/origin";
import { ACCOUNT_MAX_FAILURES, throttleDecision } from "../../../lib/auth/rate-limit";
import { can, homeFor } from "../../../lib/auth/roles";

const h = (o: Record<string, string>) => ({ get: (k: string) => o[k.toLowerCase()] ?? null });

describe("role table", () => {
  it("grants by any held role and lands each role on its home", () => {
    expect(can(["dealer"], "lots.bid")).toBe(true);
    expect(can(["dealer"], "house.manage")).toBe(false);
    expect(can(["consignor", "mediator"], "disputes.mediate")).toBe(true);
    expect(homeFor(["consignor"])).toBe("/consignor");
    expect(homeFor(["dealer", "admin"])).toBe("/house");
  });
});

describe("cross-site refusal", () => {
  const allowed = allowedOriginsFor("localhost:3000", ["http://localhost:3000"]);
  it("lets same-origin writes and all reads through", () => {
    expect(isCrossSite("POST", h({ origin: "http://localhost:3000" }), allowed)).toBe(false);
    expect(isCrossSite("GET", h({ origin: "https://elsewhere.example" }), allowed)).toBe(false);
  });
  it("refuses a foreign or opaque Origin and a cross-site fetch", () => {
    expect(isCrossSite("POST", h({ origin: "https://elsewhere.example" }), allowed)).toBe(true);
    expect(isCrossSite("DELETE", h({ origin: "null" }), allowed)).toBe(true);
    expect(isCrossSite("PATCH", h({ "sec-fetch-site": "cross-site" }), allowed)).toBe(true);
    expect(isCrossSite("PATCH", h({ "sec-fetch-site": "same-origin" }), allowed)).toBe(false);
  });
});

describe("sign-in throttle", () => {
  it("refuses once an account reaches its failure limit", () => {
    expect(throttleDecision({ byAccount: ACCOUNT_MAX_FAILURES - 1, byAddress: 0 }).allowed).toBe(true);
    expect(throttleDecision({ byAccount: ACCOUNT_MAX_FAILURES, byAddress: 0 })).toMatchObject({
      allowed: false,
      scope: "account",
    });
    expect(throttleDecision({ byAccount: 0, byAddress: 30 })).toMatchObject({ allowed: false, scope: "address" });
  });
});

describe("error shape", () => {
  it("maps codes to statuses and keeps fields", () => {
    const e = new ApiError("validation_failed", "Bad", { email: "Enter one" });
    expect(e.status).toBe(400);
    expect(e.toBody()).toEqual({
      error: { code: "validation_failed", message: "Bad", fields: { email: "Enter one" } },
    });
    expect(ERROR_STATUS.rate_limited).toBe(429);
    expect(
      fieldsFromIssues([
        { path: ["a", 0], message: "x" },
        { path: ["a", 0], message: "y" },
      ]),
    ).toEqual({ "a.0": "x" });
  });
});
