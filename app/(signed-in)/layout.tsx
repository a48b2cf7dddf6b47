import { requirePageViewer } from "@/lib/auth/guards";

/** Pages any signed-in person may open (what each sees is decided per record). */
export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  await requirePageViewer("account.read");
  return children;
}
