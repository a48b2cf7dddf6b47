import { requirePageViewer } from "@/lib/auth/guards";

export default async function HouseLayout({ children }: { children: React.ReactNode }) {
  await requirePageViewer("house.manage", "/house");
  return children;
}
