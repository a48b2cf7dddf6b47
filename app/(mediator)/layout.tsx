import { requirePageViewer } from "@/lib/auth/guards";

export default async function Layout({ children }: { children: React.ReactNode }) {
  await requirePageViewer("disputes.mediate", "/mediation");
  return children;
}
