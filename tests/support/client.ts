// A small HTTP client for the tests that keeps cookies like a browser and sends the CSRF token, and
// checks every successful API answer against its route's answer schema in the route table.
import { answerIssues, routeOf } from "./route-answers";
import { demoPassword } from "#workflows/seed";

export class ApiClient {
  private cookies = new Map<string, string>();
  /** One token for the session, fetched once even when the first changes go out at the same moment. */
  private csrfToken: Promise<string> | null = null;

  constructor(public baseUrl: string) {}

  /** The cookie header this client sends, to hand a session to another client. */
  get cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join("; ");
  }

  set cookieHeader(header: string) {
    this.cookies.clear();
    for (const pair of header.split("; ").filter(Boolean)) {
      const [name, ...value] = pair.split("=");
      this.cookies.set(name!, value.join("="));
    }
  }

  async request(
    method: string,
    path: string,
    options: { json?: unknown; form?: FormData; csrf?: boolean; headers?: Record<string, string> } = {},
  ) {
    const headers: Record<string, string> = { accept: "application/json", ...options.headers };
    if (options.csrf ?? method !== "GET") {
      this.csrfToken ??= this.fetchCsrfToken();
      headers["x-csrf-token"] = await this.csrfToken;
    }
    if (options.json !== undefined) headers["content-type"] = "application/json";
    const cookie = this.cookieHeader;
    if (cookie) headers.cookie = cookie;
    const response = await fetch(this.baseUrl + path, {
      method,
      headers,
      body: options.form ?? (options.json === undefined ? undefined : JSON.stringify(options.json)),
      redirect: "manual",
    });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const [name, ...value] = pair!.split("=");
      this.cookies.set(name!.trim(), value.join("="));
    }
    const text = await response.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    const route = response.ok && path.startsWith("/api/") ? routeOf(method, path) : null;
    const issues = route ? answerIssues(route, body) : [];
    if (issues.length > 0) throw new Error(`${method} ${path} answered ${response.status} with a body that does not fit the schema of ${route}: ${issues.slice(0, 5).join("; ")}`);
    return { status: response.status, headers: response.headers, body: body as Record<string, unknown> & { error?: { key: string; message: string; details?: unknown } } };
  }

  /** PUT a CSV file as the multipart field `file`, beside the other fields. */
  upload(path: string, file: { name: string; bytes: Uint8Array | string }, fields: Record<string, string>) {
    const form = new FormData();
    for (const [name, value] of Object.entries(fields)) form.set(name, value);
    form.set("file", new Blob([typeof file.bytes === "string" ? file.bytes : new Uint8Array(file.bytes)], { type: "text/csv" }), file.name);
    return this.request("PUT", path, { form });
  }

  private async fetchCsrfToken(): Promise<string> {
    const { body } = await this.request("GET", "/api/csrf", { csrf: false });
    return (body as { token: string }).token;
  }

  /** Signs in; the session changes, so the next state-changing request fetches a new token. */
  async signIn(email: string, password: string) {
    const response = await this.request("POST", "/api/session", { json: { email, password } });
    this.csrfToken = null;
    return response;
  }
}

/** A client signed in with a demo account ("editor" for editor@fairweigh.example); throws when the sign-in fails. */
export async function demoClient(baseUrl: string, account: string): Promise<ApiClient> {
  const client = new ApiClient(baseUrl);
  const answer = await client.signIn(`${account}@fairweigh.example`, demoPassword);
  if (answer.status !== 200) throw new Error(`signing in as ${account}@fairweigh.example answered ${answer.status}`);
  return client;
}
