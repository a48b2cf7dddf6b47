import Link from "next/link";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/forms/SignInForm";
import { safeCallbackPath } from "@/lib/auth/callback";
import { currentViewer } from "@/lib/auth/guards";
import { homeFor } from "@/lib/auth/roles";

export const metadata = { title: "Sign in" };

/** Sign in, then go back to the page that sent you here (same origin only); a signed-in visitor goes straight on. */
export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ callbackUrl?: string | string[]; from?: string | string[] }>;
}) {
  const q = await searchParams;
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  const back = safeCallbackPath(first(q.callbackUrl) ?? first(q.from));
  const viewer = await currentViewer();
  if (viewer) redirect(back ?? homeFor(viewer.roles));
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Sign in</h1>
      {back ? <p className="text-sm text-flash-700">After signing in you return to the page you asked for.</p> : null}
      <SignInForm from={back ?? undefined} />
      <p className="flex justify-between text-sm text-flash-700">
        <Link href="/forgot-password" className="underline underline-offset-2">
          Forgotten password?
        </Link>
        <Link href="/sign-up" className="underline underline-offset-2">
          Open an account
        </Link>
      </p>
    </div>
  );
}
