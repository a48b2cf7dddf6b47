import Link from "next/link";
import { ResetPasswordForm } from "@/components/forms/ResetPasswordForm";

export const metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Choose a new password</h1>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <p className="text-flash-700">
          This page needs the link from the e-mail.{" "}
          <Link href="/forgot-password" className="underline">
            Ask for a new one
          </Link>
          .
        </p>
      )}
    </div>
  );
}
