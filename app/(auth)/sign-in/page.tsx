import Link from "next/link";
import { SignInForm } from "@/components/forms/SignInForm";

export const metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ from?: string }> }) {
  const { from } = await searchParams;
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Sign in</h1>
      <SignInForm from={from} />
      <p className="flex justify-between text-sm text-flash-700">
        <Link href="/forgot-password" className="underline underline-offset-2">Forgotten password?</Link>
        <Link href="/sign-up" className="underline underline-offset-2">Open an account</Link>
      </p>
    </div>
  );
}
