// Cross-site request forgery: a state-changing call must come from our own pages. Browsers send
// Origin on every cross-origin request and on same-origin POST/PUT/PATCH/DELETE (Fetch standard,
// "origin header"), and Sec-Fetch-Site on all of them (W3C Fetch Metadata). Callers that are not
// browsers (curl, the command-line tools) send neither and carry no victim's cookie.
import { ApiProblem } from "@/lib/api/problem";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

function ownHosts(request: Request): Set<string> {
  const hosts = new Set<string>();
  for (const name of ["host", "x-forwarded-host"]) {
    const value = request.headers.get(name);
    if (value) hosts.add(value.split(",")[0].trim().toLowerCase());
  }
  const configured = process.env.NEXTAUTH_URL;
  if (configured) {
    try {
      hosts.add(new URL(configured).host.toLowerCase());
    } catch {
      // A malformed NEXTAUTH_URL only narrows the list.
    }
  }
  return hosts;
}

/** null when the request may change state; otherwise the reason it may not. */
export function foreignOriginReason(request: Request): string | null {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return null;
  const origin = request.headers.get("origin");
  if (origin !== null) {
    if (origin === "null") return "the request came from a page with no origin (a sandboxed frame or a file)";
    let host: string;
    try {
      host = new URL(origin).host.toLowerCase();
    } catch {
      return "its Origin header is not an address";
    }
    return ownHosts(request).has(host) ? null : `it came from ${origin}, another site`;
  }
  const site = request.headers.get("sec-fetch-site");
  if (site === "cross-site" || site === "same-site") return `the browser marked it ${site}`;
  return null;
}

/** 403 for a state-changing request sent by another site's page. */
export function refuseForeignOrigin(request: Request): void {
  const reason = foreignOriginReason(request);
  if (reason) {
    throw new ApiProblem(403, "foreign-origin", `Refused because ${reason}: changes can only be made from Sightward's own pages. Open Sightward and try again there.`);
  }
}
