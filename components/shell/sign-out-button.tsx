"use client";

import { useState } from "react";

/**
 * Sign out through next-auth's own endpoints, as its client's signOut does (fetch a CSRF token,
 * post it to /api/auth/signout, go where the answer says), without importing next-auth/react:
 * that module (with its SessionProvider and transpiled async helpers, about 12 KB compressed) was
 * in the JavaScript every signed-in page loads, for this one button.
 */
async function signOutTo(callbackUrl: string): Promise<void> {
  const csrf = (await (await fetch("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await fetch("/api/auth/signout", {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken: csrf.csrfToken, callbackUrl, json: "true" }),
  });
  if (!res.ok) throw new Error(`sign-out answered ${res.status}`);
  const data = (await res.json()) as { url?: string };
  const url = data.url ?? callbackUrl;
  window.location.href = url;
  if (url.includes("#")) window.location.reload();
}

export function SignOutButton() {
  const [failed, setFailed] = useState(false);
  const [busy, setBusy] = useState(false);
  return (
    <>
      <button
        type="button"
        disabled={busy}
        onClick={() => {
          setBusy(true);
          setFailed(false);
          signOutTo("/login").catch(() => {
            setFailed(true);
            setBusy(false);
          });
        }}
        className="min-h-touch rounded-lg px-3 text-sm font-medium text-graphite-200 hover:bg-graphite-800 hover:text-white"
      >
        Sign out
      </button>
      {failed ? (
        <span role="alert" className="text-xs text-graphite-200">
          Not signed out: no answer. Try again.
        </span>
      ) : null}
    </>
  );
}
