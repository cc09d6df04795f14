import type { Metadata } from "next";
import { LogoMark } from "@/components/brand/logo";
import { SetPasswordForm } from "@/components/registers/set-password-form";
import { sameOriginPath } from "@/lib/auth/redirect";

export const metadata: Metadata = { title: "Set your password" };

type Props = { searchParams: Promise<{ token?: string; callbackUrl?: string }> };

export default async function SetPasswordPage({ searchParams }: Props) {
  const { token, callbackUrl } = await searchParams;
  // After the password is set, "Sign in" may carry the person on to a page of this app, nowhere else.
  const back = sameOriginPath(callbackUrl);
  const signInHref = back ? `/login?callbackUrl=${encodeURIComponent(back)}` : "/login";
  return (
    <main className="flex min-h-screen items-center justify-center bg-graphite-50 p-6">
      <div className="w-full max-w-md space-y-6 rounded-card border border-graphite-200 bg-white p-8 shadow-sm">
        <div className="flex items-center gap-3">
          <LogoMark className="h-9 w-9" />
          <h1 className="text-xl font-semibold">Set your Trammel password</h1>
        </div>
        {token ? (
          <SetPasswordForm token={token} signInHref={signInHref} />
        ) : (
          <p className="text-sm text-graphite-700">
            This page needs the link from your invitation or password reset e-mail.
          </p>
        )}
      </div>
    </main>
  );
}
