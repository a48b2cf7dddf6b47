import Link from "next/link";
import { ConfirmEmailForm } from "@/components/forms/ConfirmEmailForm";

export const metadata = { title: "Confirm your e-mail address" };

export default async function ConfirmEmailPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Confirm your e-mail address</h1>
      {token ? (
        <ConfirmEmailForm token={token} />
      ) : (
        <p className="text-flash-700">
          This page needs the link from the e-mail we sent at sign-up. To get a new one,{" "}
          <Link href="/sign-up" className="underline">
            sign up again with the same address
          </Link>
          .
        </p>
      )}
    </div>
  );
}
