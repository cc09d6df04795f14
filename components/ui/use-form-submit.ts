"use client";

import { useState } from "react";

/**
 * The submit of a form that talks to the server itself rather than through `Form` (signing in,
 * signing a record): the page does not reload, the button is pending while `send` runs, and the
 * last error is cleared first. `send` answers an error to show, or null when it worked; the form
 * then stays pending, as it is about to be replaced (the next page, a "signed" notice).
 */
export function useFormSubmit(
  send: (form: FormData) => Promise<string | null>,
  initialError: string | null = null,
) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(initialError);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setPending(true);
    setError(null);
    const failed = await send(form);
    if (failed !== null) {
      setPending(false);
      setError(failed);
    }
  }

  return { pending, error, onSubmit };
}
