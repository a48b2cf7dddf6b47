import { describe, expect, it } from "vitest";
import { safeCallbackPath, signInHref } from "@/lib/auth/callback";

// [SUG] Our rule, after the open-redirect guidance in the OWASP Unvalidated Redirects cheat sheet: same-origin paths only.
describe("safeCallbackPath", () => {
  it("keeps a same-origin path with its query", () => {
    expect(safeCallbackPath("/sales/a/lots/b?x=1")).toBe("/sales/a/lots/b?x=1");
    expect(safeCallbackPath("/invoices/9")).toBe("/invoices/9");
  });
  it("refuses other origins and tricks", () => {
    for (const bad of [
      "https://elsewhere.example/",
      "//elsewhere.example",
      "/\\elsewhere.example",
      "javascript:alert(1)",
      "%2F%2Felsewhere.example",
      "/\telsewhere",
      "",
      null,
      undefined,
      "/sign-in?callbackUrl=/x",
    ]) {
      expect(safeCallbackPath(bad)).toBeNull();
    }
  });
  it("builds the sign-in address", () => {
    expect(signInHref("/invoices/42")).toBe("/sign-in?callbackUrl=%2Finvoices%2F42");
    expect(signInHref("//x")).toBe("/sign-in");
  });
});
