import type { Metadata } from "next";

export const metadata: Metadata = { title: "Safety cautions" };

const SECTIONS = [
  {
    id: "high-voltage",
    title: "Lethal voltage in testers and amplifiers",
    body: [
      "Tube testers apply hundreds of volts to the tube under test. Amplifier plate supplies commonly run at 300 to 700 V DC, and transmitters at kilovolts.",
      "Filter capacitors can stay charged long after equipment is switched off and unplugged. Discharge and measure before touching anything inside.",
      "Getterline never asks a consignor to power equipment. Test only if you are trained to, with equipment in sound repair.",
    ],
  },
  {
    id: "glass",
    title: "Broken glass and implosion",
    body: [
      "Bulbs crack and can implode; large envelopes and picture tubes are the worst. Wear eye protection when handling loose stock.",
      "Lift a tube by its base, not by its top cap, and never force it into or out of a socket.",
    ],
  },
  {
    id: "beryllium-oxide",
    title: "Beryllium-oxide ceramics",
    body: [
      "Some ceramic RF power, planar and microwave tubes contain beryllium oxide. It is safe while intact but highly toxic as dust.",
      "Never break, grind, file or sand such a tube. Its data sheet carries the warning; listings on Getterline flag it.",
    ],
  },
  {
    id: "radioactive",
    title: "Radioactive parts",
    body: [
      "Some cold-cathode regulator and reference tubes and many spark-gap (radar switching) tubes contain a small priming source, not always marked. Thoriated-tungsten filaments are mildly radioactive.",
      "Shipping such items may fall under dangerous-goods rules for excepted packages; check with your carrier before sending.",
    ],
  },
  {
    id: "mercury",
    title: "Mercury-vapour rectifiers",
    body: [
      "Mercury-vapour rectifiers hold liquid mercury. A broken one is a mercury spill; follow your local clean-up guidance.",
      "After transport they need a heater-only warm-up before high voltage is applied. Shipping may be regulated; check with your carrier.",
    ],
  },
  {
    id: "packing",
    title: "Packing for shipment",
    body: [
      "Box or sleeve each tube with its pins protected; double-box with at least 5 cm of cushioning all round; no tube touching another; heavy tubes held still.",
      "Pack hazard items separately and label them as your carrier requires.",
    ],
  },
];

export default function CautionsPage() {
  return (
    <article className="max-w-3xl space-y-8">
      <header className="space-y-3">
        <h1 className="text-3xl font-semibold tracking-tight">Safety cautions</h1>
        <p className="text-flash-700">
          Valves are handled safely every day, but some of the work around them can hurt you. These are the usual
          cautions, not a substitute for training: local codes, your carrier&apos;s rules and licensed practice always
          come first.
        </p>
      </header>
      {SECTIONS.map((s) => (
        <section key={s.id} id={s.id} aria-labelledby={`${s.id}-h`} className="card scroll-mt-6 space-y-2">
          <h2 id={`${s.id}-h`} className="text-lg font-semibold">
            {s.title}
          </h2>
          {s.body.map((p) => (
            <p key={p} className="text-flash-800">
              {p}
            </p>
          ))}
        </section>
      ))}
    </article>
  );
}
