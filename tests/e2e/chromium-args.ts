/**
 * Flags for Debian's headless Chromium on this closed network (no background connections, no
 * GPU): shared by the e2e harness and the browser benchmark.
 */
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];
