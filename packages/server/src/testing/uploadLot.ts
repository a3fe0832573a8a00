import type { TestClient } from './testClient.js';

/** POSTs a lot as a multipart form like the browser's FormData upload, with the client's session. */
export async function uploadLot(
  client: TestClient,
  fields: Record<string, string>,
  csv?: string | Buffer,
  fileField = 'file',
) {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.append(k, v);
  if (csv !== undefined) fd.append(fileField, new Blob([csv], { type: 'text/csv' }), 'lot.csv');
  const res = await fetch(`${client.baseUrl}/api/lots`, {
    method: 'POST',
    headers: client.cookie ? { cookie: client.cookie } : {},
    body: fd,
  });
  return { status: res.status, body: (await res.json()) as any }; // eslint-disable-line @typescript-eslint/no-explicit-any
}
