import type { TestApp } from './startTestApp.js';
import type { TestClient } from './testClient.js';

/** A client signed in through the real login route. */
export async function signIn(app: TestApp, who: { email: string; password: string }): Promise<TestClient> {
  const client = app.client();
  const res = await client.post('/api/auth/login', { email: who.email, password: who.password });
  if (res.status !== 200)
    throw new Error(`sign-in of ${who.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}
