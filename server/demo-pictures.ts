// Demo only: invented pictures for demo lots, drawn here as SVG and rendered to PNG with sharp. Plain drawings
// of a carton of valves and of one valve's glass, with the type number and the demo label printed: no photo of
// any real tube, no maker's logo or marking.
import sharp from "sharp";

/** A small deterministic random source, so a lot's pictures are the same at every demo start. */
function rng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s = (s * 1_664_525 + 1_013_904_223) >>> 0;
    return s / 2 ** 32;
  };
}

function seedOf(text: string): number {
  let h = 2_166_136_261;
  for (const c of text) h = Math.imul(h ^ c.charCodeAt(0), 16_777_619);
  return h >>> 0;
}

const esc = (s: string) => s.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c]!);

/** One valve seen from the side: glass, plates, mica, getter flash (white when `vacuumLoss`), base and pins. */
function valve(
  x: number,
  y: number,
  w: number,
  h: number,
  designation: string,
  r: () => number,
  vacuumLoss = false,
): string {
  const plate = ["#3f3f46", "#52525b", "#6b7280", "#27272a"][Math.floor(r() * 4)];
  const getter = vacuumLoss ? "#f8fafc" : ["#9ca3af", "#a8a29e", "#94a3b8"][Math.floor(r() * 3)];
  const baseH = h * 0.16;
  const glassH = h - baseH;
  return `<g>
  <rect x="${x}" y="${y + glassH}" width="${w}" height="${baseH}" rx="${w * 0.08}" fill="#1c1917"/>
  ${[0.2, 0.4, 0.6, 0.8].map((f) => `<rect x="${x + w * f - 1.5}" y="${y + h}" width="3" height="${h * 0.06}" fill="#a1a1aa"/>`).join("")}
  <rect x="${x}" y="${y}" width="${w}" height="${glassH}" rx="${w * 0.45}" fill="#e0f2fe" fill-opacity="0.55" stroke="#94a3b8" stroke-width="1.5"/>
  <ellipse cx="${x + w / 2}" cy="${y + glassH * 0.12}" rx="${w * 0.38}" ry="${glassH * 0.09}" fill="${getter}" fill-opacity="0.9"/>
  <rect x="${x + w * 0.22}" y="${y + glassH * 0.3}" width="${w * 0.56}" height="${glassH * 0.42}" rx="2" fill="${plate}"/>
  <rect x="${x + w * 0.16}" y="${y + glassH * 0.26}" width="${w * 0.68}" height="3" fill="#f5f5f4" fill-opacity="0.8"/>
  <rect x="${x + w * 0.16}" y="${y + glassH * 0.74}" width="${w * 0.68}" height="3" fill="#f5f5f4" fill-opacity="0.8"/>
  <text x="${x + w / 2}" y="${y + glassH * 0.88}" font-family="DejaVu Sans Mono, monospace" font-size="${Math.max(8, w * 0.2)}" text-anchor="middle" fill="#334155">${esc(designation)}</text>
</g>`;
}

/** A carton of valves on a bench, its label and count printed on the side. */
export async function cartonPicture(o: {
  designation: string;
  count: number;
  label: string;
  key: string;
  vacuumLoss?: number;
}): Promise<Buffer> {
  const r = rng(seedOf(o.key));
  const W = 960;
  const H = 720;
  const shown = Math.max(1, Math.min(o.count, 12));
  const cols = Math.min(6, shown);
  const rows = Math.ceil(shown / cols);
  const vw = 90;
  const vh = 230;
  const box = { x: 120, y: 180, w: 720, h: 440 };
  const tubes: string[] = [];
  for (let i = 0; i < shown; i++) {
    const cx = box.x + 40 + (i % cols) * ((box.w - 80) / cols) + (r() - 0.5) * 8;
    const cy = box.y - 140 + Math.floor(i / cols) * 150 + (r() - 0.5) * 6;
    tubes.push(valve(cx, cy, vw, vh, o.designation, r, i < (o.vacuumLoss ?? 0)));
  }
  const wood = ["#a16207", "#92400e", "#b45309"][Math.floor(r() * 3)];
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs><linearGradient id="bench" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${wood}"/><stop offset="1" stop-color="#451a03"/></linearGradient></defs>
  <rect width="${W}" height="${H}" fill="url(#bench)"/>
  ${[...Array(8)].map((_, i) => `<line x1="0" x2="${W}" y1="${90 * i + r() * 20}" y2="${90 * i + r() * 20}" stroke="#000" stroke-opacity="0.08" stroke-width="3"/>`).join("")}
  ${tubes.join("\n")}
  <rect x="${box.x}" y="${box.y + 60 * (rows - 1)}" width="${box.w}" height="${box.h - 60 * (rows - 1)}" fill="#d6b98c" stroke="#8b6b3d" stroke-width="4"/>
  <polygon points="${box.x},${box.y + 60 * (rows - 1)} ${box.x - 60},${box.y - 40 + 60 * (rows - 1)} ${box.x + 40},${box.y - 40 + 60 * (rows - 1)} ${box.x + 90},${box.y + 60 * (rows - 1)}" fill="#c9a874" stroke="#8b6b3d" stroke-width="3"/>
  <rect x="${box.x + 200}" y="${box.y + box.h - 190}" width="320" height="130" fill="#fefce8" stroke="#a8a29e" stroke-width="2"/>
  <text x="${box.x + 360}" y="${box.y + box.h - 140}" font-family="DejaVu Sans, sans-serif" font-size="26" text-anchor="middle" fill="#292524">${esc(o.label || "Mixed valves")}</text>
  <text x="${box.x + 360}" y="${box.y + box.h - 95}" font-family="DejaVu Sans Mono, monospace" font-size="34" text-anchor="middle" fill="#1c1917">${o.count} × ${esc(o.designation)}</text>
  <text x="${W - 16}" y="${H - 14}" font-family="DejaVu Sans, sans-serif" font-size="14" text-anchor="end" fill="#fef3c7" fill-opacity="0.7">Demo drawing</text>
</svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}

/** One valve up close against a grey card, for the evidence of its glass and getter. */
export async function closeUpPicture(o: { designation: string; key: string; vacuumLoss?: boolean }): Promise<Buffer> {
  const r = rng(seedOf(`${o.key}:close`));
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="720" height="900" viewBox="0 0 720 900">
  <rect width="720" height="900" fill="#e7e5e4"/>
  <rect x="40" y="40" width="640" height="820" fill="#f5f5f4" stroke="#d6d3d1" stroke-width="2"/>
  ${valve(230, 110, 260, 660, o.designation, r, o.vacuumLoss)}
  <text x="360" y="860" font-family="DejaVu Sans, sans-serif" font-size="20" text-anchor="middle" fill="#57534e">${o.vacuumLoss ? "White getter flash: vacuum lost" : "Getter flash silver: vacuum intact"} · demo drawing</text>
</svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}
