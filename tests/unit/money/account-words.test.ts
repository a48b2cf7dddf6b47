import { describe, expect, it } from "vitest";
import { ACCOUNT_WORDS, accountWords } from "../../../lib/money/account-words";
import { ACCOUNTS } from "../../../lib/money/ledger";

describe("ledger accounts in words [SUG: our wording]", () => {
  it("names every account of the ledger, each differently", () => {
    for (const a of ACCOUNTS) expect(ACCOUNT_WORDS[a]?.length, a).toBeGreaterThan(3);
    expect(new Set(ACCOUNTS.map((a) => ACCOUNT_WORDS[a])).size).toBe(ACCOUNTS.length);
  });

  it("reads escrow as money held for buyers, and never shows a code with hyphens", () => {
    expect(accountWords("escrow-held")).toBe("Held in escrow for buyers");
    expect(accountWords("consignor-payable")).toBe("Owed to consignors");
    for (const a of ACCOUNTS) expect(accountWords(a)).not.toMatch(/^[a-z]+(-[a-z]+)+$/);
  });

  it("falls back to the code in plain words for an account it does not know yet", () => {
    expect(accountWords("dispute-refunds-payable")).toBe("Dispute refunds payable");
    expect(accountWords("")).toBe("");
  });
});
