// @vitest-environment node
import { afterEach, describe, expect, it, vi } from 'vitest';
import { api, ApiError, request } from './client.js';

function respond(status: number, body: unknown, contentType = 'application/json') {
  const text = typeof body === 'string' ? body : JSON.stringify(body);
  return vi.fn(
    async () =>
      new Response(status === 204 ? null : text, { status, headers: { 'content-type': contentType } }),
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('api client', () => {
  it('returns parsed JSON on success and sends JSON bodies to /api', async () => {
    const fetchMock = respond(200, { user: { id: 'u1' } });
    vi.stubGlobal('fetch', fetchMock);
    await expect(api.auth.login('a@b.example', 'pw')).resolves.toEqual({ user: { id: 'u1' } });
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/auth/login');
    expect(init.method).toBe('POST');
    expect(JSON.parse(String(init.body))).toEqual({ email: 'a@b.example', password: 'pw' });
  });

  it('turns the server error body into an ApiError naming the field', async () => {
    vi.stubGlobal(
      'fetch',
      respond(400, {
        error: {
          message: 'samples must be at most 100000000',
          field: 'samples',
          issues: [{ path: 'samples', message: 'too big' }],
        },
      }),
    );
    const err = await request('POST', '/runs', {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({
      status: 400,
      message: 'samples must be at most 100000000',
      field: 'samples',
    });
    expect((err as ApiError).issues).toHaveLength(1);
  });

  it('copes with a non-JSON error page', async () => {
    vi.stubGlobal('fetch', respond(502, '<html>Bad gateway</html>', 'text/html'));
    const err = (await request('GET', '/designs').catch((e: unknown) => e)) as ApiError;
    expect(err.status).toBe(502);
    expect(err.message).toMatch(/Request failed \(502/);
    expect(err.field).toBeUndefined();
  });

  it('reports a network failure as status 0', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const err = (await request('GET', '/auth/me').catch((e: unknown) => e)) as ApiError;
    expect(err).toBeInstanceOf(ApiError);
    expect(err.status).toBe(0);
    expect(err.message).toMatch(/Cannot reach/);
  });

  it('accepts empty 204 responses', async () => {
    vi.stubGlobal('fetch', respond(204, ''));
    await expect(api.auth.logout()).resolves.toBeUndefined();
  });

  it('encodes query parameters and path segments', async () => {
    const fetchMock = respond(200, { designs: [] });
    vi.stubGlobal('fetch', fetchMock);
    await api.designs.list('12AX7 & friends');
    expect((fetchMock.mock.calls[0] as unknown as [string])[0]).toBe(
      '/api/designs?q=12AX7+%26+friends&archived=exclude',
    );
  });
});

describe('api.runs.sampleHead', () => {
  it('asks the bounded samples endpoint and turns null cells into NaN', async () => {
    const fetchMock = respond(200, { columns: ['sample', 'rl1', 'balanceDb'], rows: [[0, 100000, null]] });
    vi.stubGlobal('fetch', fetchMock);
    const head = await api.runs.sampleHead('r 1', 20);
    expect((fetchMock.mock.calls[0] as unknown as [string])[0]).toBe('/api/runs/r%201/samples?limit=20');
    expect(head.columns).toEqual(['sample', 'rl1', 'balanceDb']);
    expect(head.rows[0]!.slice(0, 2)).toEqual([0, 100000]);
    expect(head.rows[0]![2]).toBeNaN();
  });
});
