// The house's own details in the settings: checked as an address is, stripped of controls, named in the history.
// Check values: [SUG] our own house rules; [ISO-3166] country codes (i18n-iso-countries); MEM where marked.
import { describe, expect, it } from "vitest";
import { fieldsFromIssues } from "@/lib/api/errors";
import { houseBlock, HouseDetailsSchema, INITIAL_HOUSE_DETAILS } from "@/lib/validation/house-details";
import { settingsChanges } from "@/lib/validation/house-settings-diff";
import { HouseSettingsSchema, INITIAL_HOUSE_SETTINGS, type HouseSettings } from "@/lib/validation/house-settings";

const clone = (): HouseSettings => structuredClone(INITIAL_HOUSE_SETTINGS);
const fieldsOf = (raw: unknown) => {
  const r = HouseSettingsSchema.safeParse(raw);
  return r.success ? {} : fieldsFromIssues(r.error.issues);
};

describe("the house's details in the settings", () => {
  it("start as the invented demo house and print as a sender block [SUG]", () => {
    expect(INITIAL_HOUSE_SETTINGS.house.tradingName).toBe("Getterline Exchange"); // [SUG] scenario's house
    expect(HouseSettingsSchema.parse(INITIAL_HOUSE_SETTINGS).house).toEqual(INITIAL_HOUSE_DETAILS);
    expect(HouseDetailsSchema.parse(INITIAL_HOUSE_DETAILS)).toEqual(INITIAL_HOUSE_DETAILS);
    expect(houseBlock(INITIAL_HOUSE_DETAILS)).toEqual({
      name: "Getterline Exchange",
      lines: [
        "Flashfield Works, Unit 4",
        "27 Anode Street",
        "Glowmere, GM4 7EX",
        "United Kingdom", // GB spelled out [ISO-3166]
        "paperwork@house.getterline.test",
      ],
    });
  });

  it("are required: a document without them does not parse (the migration adds them to old versions) [SUG]", () => {
    const { house: _house, ...old } = clone();
    expect(fieldsOf(old)).toHaveProperty("house");
  });

  it("refuse a country outside ISO 3166-1, per field [ISO-3166]", () => {
    const s = clone();
    s.house.address.country = "XX"; // not assigned [ISO-3166]
    expect(fieldsOf(s)).toEqual({ "house.address.country": "Choose a country from the list" });
    s.house.address.country = "GBR"; // alpha-3, refused here [ISO-3166]
    expect(fieldsOf(s)).toHaveProperty(["house.address.country"]);
    s.house.address.country = "gb"; // lower case is read as the code it spells
    expect(HouseSettingsSchema.parse(s).house.address.country).toBe("GB");
  });

  it("refuse over-long and empty lines, a bad postal code and a bad e-mail [SUG]", () => {
    const s = clone();
    s.house.tradingName = "x".repeat(101); // [SUG] 100 at most
    s.house.address.line1 = "x".repeat(121); // [SUG] the address column holds 120
    s.house.address.city = "";
    s.house.address.postalCode = "GM4<7EX";
    s.house.paperworkEmail = "paperwork at house";
    expect(fieldsOf(s)).toEqual({
      "house.tradingName": "Trading name: at most 100 characters",
      "house.address.line1": "Address line 1: at most 120 characters",
      "house.address.city": "Give the city or town",
      "house.address.postalCode": "Postal code: letters, digits, spaces and hyphens",
      "house.paperworkEmail": "Enter a valid e-mail address",
    });
    const long = clone();
    long.house.paperworkEmail = `${"a".repeat(250)}@x.test`; // 257 characters [MEM RFC 5321: 254 at most in practice]
    expect(fieldsOf(long)).toEqual({ "house.paperworkEmail": "E-mail: at most 254 characters" });
  });

  it("strip control and direction characters as other text does [UNI-23] [UAX-9]", () => {
    const s = clone();
    s.house.tradingName = "Getterline\u0000 Exchange\u202e";
    s.house.address.line1 = "Flashfield Works,\tUnit 4";
    s.house.paperworkEmail = " Paperwork@House.Getterline.test ";
    const parsed = HouseSettingsSchema.parse(s).house;
    expect(parsed.tradingName).toBe("Getterline Exchange");
    expect(parsed.address.line1).toBe("Flashfield Works, Unit 4");
    expect(parsed.paperworkEmail).toBe("paperwork@house.getterline.test");
    // A name made only of controls is empty once stripped, so its minimum refuses it.
    s.house.tradingName = "\u0001\u0002\u202e";
    expect(fieldsOf(s)).toEqual({ "house.tradingName": "Give the house's trading name" });
  });
});

describe("the history names changes to the house's details", () => {
  it("by section and field, in words [SUG]", () => {
    const a = clone();
    const b = clone();
    b.house.tradingName = "Getterline Exchange Ltd";
    b.house.address.line2 = "";
    b.house.address.city = "Emberton";
    b.house.address.postalCode = "EM1 2AB";
    b.house.paperworkEmail = "desk@house.getterline.test";
    expect(settingsChanges(a, b)).toEqual([
      "House details · address city: Glowmere → Emberton",
      "House details · address line 2: 27 Anode Street → (blank)",
      "House details · address postal code: GM4 7EX → EM1 2AB",
      "House details · paperwork e-mail: paperwork@house.getterline.test → desk@house.getterline.test",
      "House details · trading name: Getterline Exchange → Getterline Exchange Ltd",
    ]);
  });
});
