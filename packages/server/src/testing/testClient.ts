/* eslint-disable @typescript-eslint/no-explicit-any -- test responses are checked field by field */
/** A response as tests read it: status, parsed JSON body (or text), headers. */
export interface TestResponse<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

/**
 * A tiny HTTP client bound to a base URL that keeps the session cookie like a browser would
 * (set on Set-Cookie, dropped when cleared). Uses Node's fetch against a real listening server.
 */
export class TestClient {
  cookie: string | undefined;

  constructor(readonly baseUrl: string) {}

  async request<T = any>(method: string, path: string, body?: unknown): Promise<TestResponse<T>> {
    const headers: Record<string, string> = {};
    if (this.cookie) headers.cookie = this.cookie;
    if (body !== undefined) headers['content-type'] = 'application/json';
    const res = await fetch(this.baseUrl + path, {
      method,
      headers,
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
      redirect: 'manual',
    });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const [name, value] = pair!.split('=');
      if (name !== 'sigmatail_session') continue;
      this.cookie = value ? `${name}=${value}` : undefined;
    }
    const text = await res.text();
    let parsed: unknown = text;
    if (res.headers.get('content-type')?.includes('json')) parsed = JSON.parse(text);
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  get<T = any>(path: string) {
    return this.request<T>('GET', path);
  }
  post<T = any>(path: string, body?: unknown) {
    return this.request<T>('POST', path, body ?? {});
  }
  patch<T = any>(path: string, body?: unknown) {
    return this.request<T>('PATCH', path, body ?? {});
  }
  delete<T = any>(path: string) {
    return this.request<T>('DELETE', path);
  }
}
