// Trammel's service worker: keeps what an installer needs at the machine when the signal drops.
// Hand-written and small on purpose. Pages of a job opened on this tablet (its checklist with the
// procedure, instruments and last readings, and its comparison) are fetched from the network
// first and kept; without a connection, or when the server cannot answer, the kept copy is shown.
// The app's own scripts, styles and fonts are kept once fetched (their names change with each
// build). The thumbnails of a job's photos (/api/photos/{id}/thumb, never changed once made) are
// kept with the job's pages, so they show without signal and go when the user signs out.
// Readings and photos typed offline never pass through here: the page keeps them in IndexedDB and
// sends them itself. Nothing but GET requests of this origin is touched.
const VERSION = "v2";
const PAGES = `trammel-pages-${VERSION}`;
const ASSETS = `trammel-assets-${VERSION}`;

self.addEventListener("install", () => self.skipWaiting());

self.addEventListener("activate", (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys())
        if (name.startsWith("trammel-") && name !== PAGES && name !== ASSETS) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

const isAsset = (url) =>
  url.pathname.startsWith("/_next/static/") || /\.(woff2|ttf|svg|png|ico)$/.test(url.pathname);
const isJobData = (url) => /^\/(jobs|api\/jobs)\/[^/]+(\/(checklist|compare|readings|comparison))?$/.test(url.pathname);

const isPhotoThumb = (url) => /^\/api\/photos\/[0-9a-f-]{36}\/thumb$/.test(url.pathname);

async function keep(cacheName, request, response) {
  if (response && response.ok && !response.redirected && response.type === "basic")
    await (await caches.open(cacheName)).put(request, response.clone());
  return response;
}

async function networkFirst(request) {
  try {
    const res = await fetch(request);
    // Signed out (the server sent the sign-in page): nothing of the last person's jobs stays here.
    if (res.redirected && new URL(res.url).pathname === "/login") {
      await caches.delete(PAGES);
      return res;
    }
    if (res.status >= 500) {
      const kept = await caches.match(request, { ignoreVary: true });
      if (kept) return kept;
    }
    return keep(PAGES, request, res);
  } catch (err) {
    const kept = await caches.match(request, { ignoreVary: true });
    if (kept) return kept;
    if (request.mode === "navigate")
      return new Response(
        "<!doctype html><meta charset=utf-8><title>Offline</title><p style='font:18px sans-serif;padding:2rem'>" +
          "No connection, and this page was not opened on this tablet before. Open the job's checklist " +
          "once while connected to keep it here.</p>",
        { status: 503, headers: { "content-type": "text/html; charset=utf-8" } },
      );
    throw err;
  }
}

async function cacheFirst(request, cacheName = ASSETS) {
  const kept = await caches.match(request, { ignoreVary: true });
  if (kept) return kept;
  return keep(cacheName, request, await fetch(request));
}

self.addEventListener("fetch", (event) => {
  const { request } = event;
  if (request.method !== "GET") return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (isAsset(url)) return event.respondWith(cacheFirst(request));
  // React Server Component requests (in-app navigation, refresh) go to the network as they are.
  if (request.headers.get("RSC") === "1" || url.searchParams.has("_rsc")) return;
  if (isJobData(url)) return event.respondWith(networkFirst(request));
  if (isPhotoThumb(url)) return event.respondWith(cacheFirst(request, PAGES));
});

// The checklist page asks for its job to be kept: the page, the comparison, the job's JSON and
// readings, its photos' thumbnails, and the scripts the page already loaded before this worker
// controlled it.
self.addEventListener("message", (event) => {
  const data = event.data;
  if (!data || data.type !== "keep-job" || !Array.isArray(data.urls)) return;
  event.waitUntil(
    Promise.all(
      data.urls.map(async (u) => {
        const url = new URL(u, self.location.origin);
        if (url.origin !== self.location.origin) return;
        const request = new Request(url, { credentials: "same-origin" });
        try {
          if (isAsset(url)) {
            if (!(await caches.match(request))) await keep(ASSETS, request, await fetch(request));
          } else if (isJobData(url)) await keep(PAGES, request, await fetch(request));
          else if (isPhotoThumb(url)) {
            if (!(await caches.match(request, { ignoreVary: true }))) await keep(PAGES, request, await fetch(request));
          }
        } catch {
          /* kept next time the job is opened */
        }
      }),
    ).then(() => event.source && event.source.postMessage({ type: "job-kept" })),
  );
});
