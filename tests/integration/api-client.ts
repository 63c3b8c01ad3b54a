/**
 * A small HTTP client for the integration tests: keeps the session cookie like a browser does
 * and sends the Origin header of the app, as a same-origin page would.
 */
export interface ApiResponse<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export class ApiClient {
  readonly #baseUrl: string;
  readonly #cookies = new Map<string, string>();

  constructor(baseUrl: string) {
    this.#baseUrl = baseUrl;
  }

  get signedIn(): boolean {
    return [...this.#cookies.keys()].some((name) => name.includes("session_token"));
  }

  /** GET with an Accept header, the body as bytes (for binary answers). */
  async getBytes(path: string, accept: string): Promise<{ status: number; bytes: ArrayBuffer; headers: Headers }> {
    const headers: Record<string, string> = { origin: this.#baseUrl, accept };
    if (this.#cookies.size > 0) headers.cookie = [...this.#cookies].map(([name, value]) => `${name}=${value}`).join("; ");
    const response = await fetch(`${this.#baseUrl}${path}`, { headers, redirect: "manual" });
    return { status: response.status, bytes: await response.arrayBuffer(), headers: response.headers };
  }

  /** GET whose body is read chunk by chunk (each chunk handed to `onChunk`, nothing kept), for large downloads. */
  async stream(path: string, onChunk: (chunk: Uint8Array) => void): Promise<{ status: number; headers: Headers }> {
    const headers: Record<string, string> = { origin: this.#baseUrl };
    if (this.#cookies.size > 0) headers.cookie = [...this.#cookies].map(([name, value]) => `${name}=${value}`).join("; ");
    const response = await fetch(`${this.#baseUrl}${path}`, { headers, redirect: "manual" });
    if (response.body) for await (const chunk of response.body) onChunk(chunk as Uint8Array);
    return { status: response.status, headers: response.headers };
  }

  async request<T = any>(
    method: string,
    path: string,
    options: { json?: unknown; rawBody?: string; form?: FormData; headers?: Record<string, string> } = {},
  ): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { origin: this.#baseUrl, ...options.headers };
    if (this.#cookies.size > 0) headers.cookie = [...this.#cookies].map(([name, value]) => `${name}=${value}`).join("; ");
    let body: string | FormData | undefined;
    if (options.form !== undefined) {
      // fetch sets Content-Type: multipart/form-data with its boundary.
      body = options.form;
    } else if (options.json !== undefined) {
      headers["content-type"] = "application/json";
      body = JSON.stringify(options.json);
    } else if (options.rawBody !== undefined) {
      headers["content-type"] ??= "application/json";
      body = options.rawBody;
    }
    const response = await fetch(`${this.#baseUrl}${path}`, { method, headers, body, redirect: "manual" });
    for (const line of response.headers.getSetCookie()) {
      const [pair = ""] = line.split(";");
      const eq = pair.indexOf("=");
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (value === "" || /max-age=0/i.test(line)) this.#cookies.delete(name);
      else this.#cookies.set(name, value);
    }
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: response.status, body: parsed as T, headers: response.headers };
  }

  /** POST of one file as multipart/form-data in `field` (as a browser's file input sends it). */
  upload<T = any>(path: string, file: { name: string; text: string | Uint8Array; type?: string }, field = "file") {
    const form = new FormData();
    form.append(field, new Blob([file.text], { type: file.type ?? "text/csv" }), file.name);
    return this.request<T>("POST", path, { form });
  }

  get<T = any>(path: string) {
    return this.request<T>("GET", path);
  }

  post<T = any>(path: string, json?: unknown) {
    return this.request<T>("POST", path, json === undefined ? {} : { json });
  }

  /**
   * Signs up, then signs in as the web app does (sign-up alone starts no session, so that a taken
   * address gets the same answer as a fresh one). Returns the sign-up's answer; the session's
   * Set-Cookie is on `signInResponse`.
   */
  async signUp(user: { name: string; email: string; password: string }): Promise<ApiResponse & { signInResponse?: ApiResponse }> {
    const response = await this.post("/api/auth/sign-up/email", user);
    if (response.status !== 200) return response;
    return { ...response, signInResponse: await this.signIn(user.email, user.password) };
  }

  async signIn(email: string, password: string): Promise<ApiResponse> {
    return this.post("/api/auth/sign-in/email", { email, password });
  }

  async signOut(): Promise<ApiResponse> {
    return this.post("/api/auth/sign-out", {});
  }
}

/** A unique suffix per test run, so runs can share one database. */
export const RUN_ID = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;

let serial = 0;

/** A fresh user name and email under the reserved .example domain. */
export function freshUser(label: string): { name: string; email: string; password: string } {
  serial += 1;
  return {
    name: `Test ${label} ${RUN_ID}-${serial}`,
    email: `${label.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${RUN_ID}-${serial}@loopyard-tests.example`,
    password: "correct-horse-battery",
  };
}

/** Signs up a fresh user and returns a client holding their session. */
export async function signedInClient(baseUrl: string, label: string): Promise<{ client: ApiClient; user: ReturnType<typeof freshUser> }> {
  const client = new ApiClient(baseUrl);
  const user = freshUser(label);
  const response = await client.signUp(user);
  if (response.status !== 200) throw new Error(`sign-up of ${user.email} failed: ${response.status} ${JSON.stringify(response.body)}`);
  return { client, user };
}
