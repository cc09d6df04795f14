import { palette } from "@/lib/domain/theme";
import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { Wordmark } from "@/components/brand/logo";
import { safeRedirectPath } from "@/lib/auth/redirect";
import { getCurrentUser } from "@/lib/auth/session";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

type Props = { searchParams: Promise<{ callbackUrl?: string; error?: string; wait?: string }> };

export default async function LoginPage({ searchParams }: Props) {
  const { callbackUrl, error, wait } = await searchParams;
  if (await getCurrentUser()) redirect(safeRedirectPath(callbackUrl));
  return (
    <main className="grid min-h-screen lg:grid-cols-[1.1fr_1fr]">
      <section className="relative hidden overflow-hidden bg-graphite-900 p-12 text-graphite-100 lg:flex lg:flex-col lg:justify-between">
        <Wordmark size="xl" />
        <div className="max-w-md space-y-4">
          <p className="text-3xl font-semibold leading-tight text-white">
            Every reading against its tolerance. Every head proven, signed and accepted.
          </p>
          <p className="text-graphite-300">
            Record the installation of two-axis heads, fit their kinematic errors from probe data, and hand
            the customer an acceptance report that still verifies years from now.
          </p>
        </div>
        <svg viewBox="0 0 400 160" className="w-full max-w-lg text-graphite-700" aria-hidden="true">
          <line x1="0" y1="120" x2="400" y2="120" stroke="currentColor" strokeWidth="1" />
          <path
            d="M20 120 C 120 112, 220 128, 380 118"
            fill="none"
            stroke={palette.accent[500]}
            strokeWidth="2.5"
          />
          <path
            d="M20 120 L 380 120"
            fill="none"
            stroke={palette.nominal[300]}
            strokeWidth="1.5"
            strokeDasharray="6 5"
          />
          {Array.from({ length: 13 }, (_, i) => (
            <line
              key={i}
              x1={20 + i * 30}
              y1={114}
              x2={20 + i * 30}
              y2={126}
              stroke="currentColor"
              strokeWidth="1"
            />
          ))}
        </svg>
      </section>
      <section className="flex items-center justify-center p-6">
        <div className="w-full max-w-sm space-y-8">
          <Wordmark size="lg" className="lg:hidden" />
          <div>
            <h1 className="text-2xl font-semibold text-graphite-900">Sign in</h1>
            <p className="mt-1 text-sm text-graphite-600">
              Use the e-mail address your service company or administrator registered.
            </p>
          </div>
          <SignInForm
            callbackUrl={safeRedirectPath(callbackUrl)}
            initialError={error}
            initialWaitS={Number(wait) > 0 ? Math.min(Number(wait), 86_400) : undefined}
          />
        </div>
      </section>
    </main>
  );
}
