import type { Metadata } from "next";
import Link from "next/link";
import { LogoMark } from "@/components/brand/logo";
import { ForgotPasswordForm } from "./forgot-form";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <main className="flex min-h-screen items-center justify-center bg-graphite-50 p-6">
      <div className="w-full max-w-md space-y-6 rounded-card border border-graphite-200 bg-white p-8 shadow-sm">
        <div className="flex items-center gap-3">
          <LogoMark className="h-9 w-9" />
          <h1 className="text-xl font-semibold">Forgot your password?</h1>
        </div>
        <p className="text-sm text-graphite-700">
          Enter the e-mail address of your account. We send a link to choose a new password; it works once,
          for one hour. Choosing a new password also ends every open session of the account and lifts any
          sign-in delay on it.
        </p>
        <ForgotPasswordForm />
        <p className="text-sm">
          <Link href="/login" className="text-accent-700 underline">
            Back to sign in
          </Link>
        </p>
      </div>
    </main>
  );
}
