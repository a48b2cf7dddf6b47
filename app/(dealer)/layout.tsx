import { requirePageViewer } from "@/lib/auth/guards";

export default async function Layout({ children }: { children: React.ReactNode }) {
  await requirePageViewer("lots.bid", "/dealer");
  return children;
}
