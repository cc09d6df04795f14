/**
 * Launch flags for Debian's Chromium (no downloaded browser), shared by the browser tests and the
 * page benchmark: no sandbox as root, no background networking on a closed network, software
 * WebGL for the 3D view.
 */
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
  "--use-angle=swiftshader",
  "--enable-unsafe-swiftshader",
];
