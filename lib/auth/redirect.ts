/**
 * The one place that decides where the app may send a browser after sign-in, set-password or any
 * other `callbackUrl`: only a path on this app's own origin. Browsers read `/\host`, `/\t/host`
 * and `//host` as another host, so a value is refused when it has a backslash or a control
 * character anywhere, does not start with a single `/`, or resolves (WHATWG URL parsing) to any
 * origin but our own. What comes back is the normalised path, query and fragment, never a URL
 * with a host of its own.
 */

/** Where a refused or missing target sends people. */
export const DEFAULT_AFTER_SIGN_IN = "/jobs";

/** Any C0 control, space-less DEL or C1 control (tab, newline, NUL… which URL parsing drops or reads oddly). */
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;
/** A stand-in origin for parsing: only whether the result stays on it matters. */
const BASE = "http://trammel.invalid";

/** The same-origin path `target` names, or null when it names anything else. */
export function sameOriginPath(target: unknown, origin = BASE): string | null {
  if (typeof target !== "string" || target.length === 0 || target.length > 2048) return null;
  if (CONTROL.test(target) || target.includes("\\")) return null;
  let decoded = target;
  try {
    decoded = decodeURIComponent(target);
  } catch {
    return null;
  }
  // An encoded backslash or control character is refused too: some servers and clients decode once more.
  if (CONTROL.test(decoded) || decoded.includes("\\")) return null;
  let url: URL;
  let base: URL;
  try {
    base = new URL(origin);
    url = new URL(target, base);
  } catch {
    return null;
  }
  if (url.origin !== base.origin) return null;
  // An absolute URL on our own origin is accepted (next-auth hands those over); a relative one must be a path.
  if (!target.startsWith(`${base.origin}/`) && (!target.startsWith("/") || target.startsWith("//")))
    return null;
  const path = `${url.pathname}${url.search}${url.hash}`;
  return path.startsWith("//") ? null : path;
}

/** `sameOriginPath(target)` or the default page. */
export function safeRedirectPath(target: unknown, fallback = DEFAULT_AFTER_SIGN_IN): string {
  return sameOriginPath(target) ?? fallback;
}
