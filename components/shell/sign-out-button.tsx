"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/login" })}
      className="min-h-touch rounded-lg px-3 text-sm font-medium text-graphite-200 hover:bg-graphite-800 hover:text-white"
    >
      Sign out
    </button>
  );
}
