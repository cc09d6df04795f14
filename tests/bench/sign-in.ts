// Signing in for the benchmarks and fault tests: through next-auth's real credentials endpoint,
// as a browser does (CSRF cookie, then the callback), returning the cookie header to send.
/** A cookie jar signed in through next-auth's real credentials endpoint on `base`. */
export async function signIn(base: string, email: string, password = "trammel-demo"): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair!.indexOf("=");
      jar.set(pair!.slice(0, i), pair!.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  keep(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.includes("session-token")))
    throw new Error(`sign-in as ${email} on ${base} failed (${res.status})`);
  return cookie();
}
