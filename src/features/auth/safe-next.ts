import { paths } from "@/app/paths";

const BASE = "https://spreadsight.invalid";

/**
 * Where to go after signing in: the `next` parameter when it is a path on this site, else the
 * sites list. Refused: anything that is not a plain absolute path ("//evil.test", "/\\evil.test"
 * which browsers read as "//evil.test", "https://…", "javascript:…"), backslashes and control
 * characters anywhere. The answer is rebuilt from the parsed URL, so it is always a same-site
 * path that the router can navigate to.
 */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith("/") || next.startsWith("//")) return paths.sites;
  // eslint-disable-next-line no-control-regex
  if (/[\\\u0000-\u001f\u007f]/.test(next)) return paths.sites;
  let url: URL;
  try {
    url = new URL(next, BASE);
  } catch {
    return paths.sites;
  }
  if (url.origin !== BASE) return paths.sites;
  return `${url.pathname}${url.search}${url.hash}`;
}
