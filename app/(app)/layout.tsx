import Link from "next/link";
import { Wordmark } from "@/components/brand/logo";
import { MainNav } from "@/components/shell/main-nav";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { ROLE_LABELS } from "@/lib/domain/roles";
import { navigationFor } from "@/lib/policy/navigation";
import { requirePageUser } from "@/lib/auth/session";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  return (
    <div className="flex min-h-screen flex-col">
      <header className="sticky top-0 z-20 bg-graphite-900 text-white shadow">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-1 px-4 py-2 sm:px-6">
          <Link href="/jobs" className="flex min-h-touch items-center" aria-label="Trammel, jobs">
            <Wordmark />
          </Link>
          <MainNav items={navigationFor(user)} />
          <div className="ml-auto flex items-center gap-3">
            <div className="text-right leading-tight" data-testid="current-user">
              <p className="text-sm font-medium">{user.name}</p>
              <p className="text-xs text-graphite-300">{ROLE_LABELS[user.role]}</p>
            </div>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 sm:px-6">{children}</main>
      <footer className="border-t border-graphite-200 py-4 text-center text-xs text-graphite-500">
        Trammel · records, fits and acceptance of two-axis heads
      </footer>
    </div>
  );
}
