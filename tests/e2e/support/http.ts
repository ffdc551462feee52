// Signs in through next-auth's own credentials callback with a cookie jar, as a browser would.
import { baseUrl } from "./server";

export class CookieJar {
  private readonly cookies = new Map<string, string>();

  store(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair!.indexOf("=");
      const name = pair!.slice(0, eq).trim();
      const value = pair!.slice(eq + 1).trim();
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value === "") this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join("; ");
  }

  has(suffix: string): boolean {
    return [...this.cookies.keys()].some((name) => name.endsWith(suffix));
  }
}

export interface Caller {
  jar: CookieJar;
  request(path: string, init?: { method?: string; json?: unknown; body?: string; headers?: Record<string, string>; signal?: AbortSignal }): Promise<Response>;
}

/** A cookie-jar client of the app under test, or of another copy of the app at `base`. */
export function caller(base?: string): Caller {
  const jar = new CookieJar();
  return {
    jar,
    async request(path, init = {}) {
      const headers: Record<string, string> = { ...init.headers };
      const cookie = jar.header();
      if (cookie) headers.cookie = cookie;
      let body = init.body;
      if (init.json !== undefined) {
        headers["content-type"] = "application/json";
        body = JSON.stringify(init.json);
      }
      const response = await fetch((base ?? baseUrl()) + path, { method: init.method ?? "GET", headers, body, redirect: "manual", signal: init.signal });
      jar.store(response);
      return response;
    },
  };
}

/** A caller signed in with e-mail and password; the answer of the credentials callback is returned too. */
export async function signedIn(email: string, password: string, base?: string): Promise<{ who: Caller; status: number }> {
  const who = caller(base);
  const csrf = (await (await who.request("/api/auth/csrf")).json()) as { csrfToken: string };
  const form = new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: "true" });
  const response = await who.request("/api/auth/callback/credentials", {
    method: "POST",
    body: form.toString(),
    headers: { "content-type": "application/x-www-form-urlencoded" },
  });
  return { who, status: response.status };
}
