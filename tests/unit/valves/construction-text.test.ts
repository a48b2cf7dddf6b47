import { describe, expect, it } from "vitest";
import { featuresFromText, featuresToText } from "../../../lib/valves/construction-text";

// Vocabulary round trips: our own feature names [SUG]; no external source applies.
describe("construction features as text", () => {
  it("reads names in any case and values with spaces, and keeps unknowns apart", () => {
    const { features, ignored } = featuresFromText({
      PlateColour: "Grey",
      getter_shape: "d shape",
      micacount: "3",
      metalSkirt: "yes",
      colourOfBox: "red",
      plateShape: "oval",
    });
    expect(features).toEqual({ plateColour: "grey", getterShape: "d-shape", micaCount: 3, metalSkirt: true });
    expect(ignored.sort()).toEqual(["colourOfBox", "plateShape=oval"]);
  });

  it("round-trips typed features", () => {
    const f = { plateSurface: "ribbed", micaCount: 2, micaSpringClips: false } as const;
    expect(featuresFromText(featuresToText(f)).features).toEqual(f);
  });

  it("refuses counts outside plausible bounds", () => {
    expect(featuresFromText({ micaCount: "9" }).ignored).toEqual(["micaCount=9"]);
  });
});
