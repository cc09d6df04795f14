import Link from "next/link";
import { LogoMark } from "@/components/brand/logo";

/** Public pages: anyone holding a report can check it, without an account. */
export default function VerifyLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="min-h-screen">
      <header className="bg-graphite-900 text-white">
        <div className="mx-auto flex max-w-3xl items-center gap-3 px-4 py-3">
          <Link href="/verify" className="flex min-h-touch items-center gap-2">
            <LogoMark />
            <span className="text-lg font-semibold">Trammel</span>
          </Link>
          <span className="text-graphite-300">· Verify a report</span>
        </div>
      </header>
      <main className="mx-auto max-w-3xl space-y-6 px-4 py-8">{children}</main>
    </div>
  );
}
