import { ForgotPasswordForm } from "@/components/forms/ForgotPasswordForm";

export const metadata = { title: "Reset your password" };

export default function ForgotPasswordPage() {
  return (
    <div className="card space-y-5">
      <h1 className="text-2xl font-semibold">Reset your password</h1>
      <p className="text-sm text-flash-700">We will e-mail a link that lets you choose a new password.</p>
      <ForgotPasswordForm />
    </div>
  );
}
