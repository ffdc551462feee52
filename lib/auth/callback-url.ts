// Where sign-in may send a person afterwards: only a path of our own site. Browsers read a
// backslash as a slash in the authority ("/\evil.example" means "//evil.example", WHATWG URL
// standard, "special-authority-ignore-slashes state"), and skip tabs and newlines, so those are
// refused along with "//host" and any absolute address.
const BASE = "http://sightward.invalid";

/** The path itself when it stays on this site, otherwise "/". */
export function safeCallbackPath(value: string | string[] | null | undefined): string {
  const raw = Array.isArray(value) ? value[0] : value;
  if (typeof raw !== "string" || raw.length === 0 || raw.length > 2000) return "/";
  if (!raw.startsWith("/") || raw.startsWith("//")) return "/";
  // Backslashes, control characters (tab, newline, NUL…) and their percent-encoded forms in the
  // first segment could turn into another host after decoding; no page of ours needs them.
  if (/[\\\u0000-\u001f\u007f]/.test(raw)) return "/";
  let decoded: string;
  try {
    decoded = decodeURIComponent(raw);
  } catch {
    return "/";
  }
  if (/[\\\u0000-\u001f\u007f]/.test(decoded) || decoded.startsWith("//")) return "/";
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return "/";
  }
  if (url.origin !== BASE) return "/";
  return url.pathname + url.search + url.hash;
}

/** next-auth's redirect callback: our own absolute addresses and safe paths; anything else goes home. */
export function safeRedirect(url: string, baseUrl: string): string {
  if (url.startsWith(baseUrl + "/") || url === baseUrl) {
    return baseUrl + safeCallbackPath(url.slice(baseUrl.length) || "/");
  }
  return baseUrl + safeCallbackPath(url);
}
