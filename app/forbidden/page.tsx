import Link from "next/link";

export const metadata = { title: "Not for your account" };

export default function ForbiddenPage() {
  return (
    <div className="max-w-xl space-y-3">
      <h1 className="text-2xl font-semibold">This page is not part of your account&apos;s roles</h1>
      <p className="text-flash-700">
        Your account does not hold the role this page needs. Mediator and house roles are granted by the house; write to
        the sales desk if you think you should have one.
      </p>
      <Link href="/" className="btn-quiet">
        Back to the start
      </Link>
    </div>
  );
}
