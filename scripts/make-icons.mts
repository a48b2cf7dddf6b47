// Render the favicon and app icons from our mark (app/icon.svg) with sharp, so they can be made again
// whenever the mark changes: `node --import tsx scripts/make-icons.mts`. Writes app/favicon.ico (16, 32, 48),
// app/apple-icon.png (180) and public/icons/icon-192.png, icon-512.png (with a safe zone, for maskable use).
import { mkdir, readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import pngToIco from "png-to-ico";
import sharp from "sharp";

const root = path.resolve(import.meta.dirname, "..");
const svg = await readFile(path.join(root, "app/icon.svg"));

/** The mark at `size` px, optionally inset on a white tile so a round or squircle mask keeps it whole. */
async function png(size: number, insetPct = 0): Promise<Buffer> {
  const inner = Math.round(size * (1 - insetPct / 100));
  const mark = await sharp(svg, { density: Math.max(72, Math.ceil((72 * inner) / 32)) })
    .resize(inner, inner)
    .png()
    .toBuffer();
  if (!insetPct) return mark;
  const pad = Math.floor((size - inner) / 2);
  return sharp({ create: { width: size, height: size, channels: 4, background: "#ffffff" } })
    .composite([{ input: mark, left: pad, top: pad }])
    .png()
    .toBuffer();
}

await mkdir(path.join(root, "public/icons"), { recursive: true });
await writeFile(path.join(root, "app/favicon.ico"), await pngToIco([await png(16), await png(32), await png(48)]));
await writeFile(path.join(root, "app/apple-icon.png"), await png(180, 10));
await writeFile(path.join(root, "public/icons/icon-192.png"), await png(192, 20));
await writeFile(path.join(root, "public/icons/icon-512.png"), await png(512, 20));
console.log("icons written: app/favicon.ico, app/apple-icon.png, public/icons/icon-192.png, public/icons/icon-512.png");
