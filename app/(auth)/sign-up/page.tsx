import Link from "next/link";
import { SignUpForm } from "@/components/forms/SignUpForm";

export const metadata = { title: "Open an account" };

export default function SignUpPage() {
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Open an account</h1>
      <p className="text-sm text-flash-700">
        Dealers bid; consignors list. Mediator and house roles are granted by the house.
      </p>
      <SignUpForm />
      <p className="text-sm text-flash-700">
        Already have an account?{" "}
        <Link href="/sign-in" className="underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </div>
  );
}
