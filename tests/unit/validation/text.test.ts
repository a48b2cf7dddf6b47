import { describe, expect, it } from "vitest";
import { DisputeMessageSchema } from "../../../lib/validation/disputes";
import { LotDetailsSchema } from "../../../lib/validation/lots";
import { cleanLine, cleanMultiline } from "../../../lib/validation/text";

const cp = (...codes: number[]) => String.fromCodePoint(...codes);

describe("control characters are stripped at the boundary", () => {
  // [UNI-23] C0 controls U+0000–U+001F, DEL U+007F, C1 controls U+0080–U+009F.
  it.each([
    ["NUL U+0000", 0x0000],
    ["BEL U+0007", 0x0007],
    ["BS U+0008", 0x0008],
    ["VT U+000B", 0x000b],
    ["FF U+000C", 0x000c],
    ["ESC U+001B", 0x001b],
    ["US U+001F", 0x001f],
    ["DEL U+007F", 0x007f],
    ["PAD U+0080", 0x0080],
    ["NEL U+0085", 0x0085],
    ["CSI U+009B", 0x009b],
    ["APC U+009F", 0x009f],
  ])("%s goes from one-line and multi-line text [UNI-23]", (_name, code) => {
    expect(cleanLine(`6V6${cp(code)}GT`)).toBe("6V6GT");
    expect(cleanMultiline(`matched${cp(code)} pair`)).toBe("matched pair");
  });

  // [UAX-9] §2.2 explicit embeddings and overrides LRE, RLE, PDF, LRO, RLO; §2.4 isolates LRI, RLI, FSI, PDI.
  it.each([
    ["LRE U+202A", 0x202a],
    ["RLE U+202B", 0x202b],
    ["PDF U+202C", 0x202c],
    ["LRO U+202D", 0x202d],
    ["RLO U+202E", 0x202e],
    ["LRI U+2066", 0x2066],
    ["RLI U+2067", 0x2067],
    ["FSI U+2068", 0x2068],
    ["PDI U+2069", 0x2069],
  ])("the bidi control %s goes, so a figure cannot be shown reversed [UAX-9]", (_name, code) => {
    expect(cleanLine(`reserve 120${cp(code)}05 dollars`)).toBe("reserve 12005 dollars");
    expect(cleanMultiline(`${cp(code)}gm 5200`)).toBe("gm 5200");
  });

  it("keeps tab and line feed in multi-line text, turns CR LF into LF, and flattens one-line text [UNI-23]", () => {
    expect(cleanMultiline("tested\r\non\tthe bench\rtwice")).toBe("tested\non\tthe bench\ntwice");
    expect(cleanLine("box\tof\nten\r\nvalves")).toBe("box of ten valves");
    // U+2028 LINE SEPARATOR and U+2029 PARAGRAPH SEPARATOR are line breaks, never inside a title [UNI-23]
    expect(cleanLine(`pair${cp(0x2028)}quad${cp(0x2029)}`)).toBe("pair quad "); // the schema trims the end
  });

  it("drops U+FEFF and lone surrogates but keeps letters of other scripts, emoji joiners and LRM U+200E [UAX-9]", () => {
    expect(cleanLine(`${cp(0xfeff)}Röhre ламп 真空管`)).toBe("Röhre ламп 真空管");
    expect(cleanLine("a\ud800b\udc00c")).toBe("abc");
    const family = cp(0x1f468, 0x200d, 0x1f527); // emoji with ZERO WIDTH JOINER U+200D
    expect(cleanLine(`ok ${family}`)).toBe(`ok ${family}`);
    expect(cleanLine(`x${cp(0x200e)}y`)).toBe(`x${cp(0x200e)}y`);
  });

  it("the lot and message schemas use the helper: a title made only of controls fails its minimum [SUG]", () => {
    const base = { provenance: "", shippingOrigin: "", testerKind: "untested" as const, testerNotes: "" };
    const r = LotDetailsSchema.safeParse({ ...base, title: `${cp(0x202e)}${cp(0)}${cp(0x2066)}ab` });
    expect(r.success).toBe(false);
    const ok = LotDetailsSchema.parse({ ...base, title: `Ten${cp(0x202e)} 6SN7`, testerNotes: "line 1\r\nline 2" });
    expect(ok.title).toBe("Ten 6SN7");
    expect(ok.testerNotes).toBe("line 1\nline 2");
    expect(DisputeMessageSchema.parse({ body: `see${cp(0x0000)} photo 3${cp(0x2069)}` }).body).toBe("see photo 3");
  });
});
