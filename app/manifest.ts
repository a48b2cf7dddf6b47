// GET /manifest.webmanifest — the web app manifest: our name, mark and palette (tailwind.config.ts)
import type { MetadataRoute } from "next";

export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Getterline",
    short_name: "Getterline",
    description: "A live exchange for wholesale lots of vintage vacuum tubes",
    start_url: "/",
    display: "standalone",
    background_color: "#f7f7f8", // flash-50: the page ground
    theme_color: "#ffffff", // the header's white
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
    ],
  };
}
