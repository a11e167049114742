// A supertest agent that keeps cookies and sends the CSRF token, as the browser client does.
import request from 'supertest';
import type { Express } from 'express';
import { defaultTestPassword } from './builders/accounts.js';

export interface ApiClient {
  agent: ReturnType<typeof request.agent>;
  csrfToken: string;
  get(path: string): request.Test;
  post(path: string, body?: object): request.Test;
  put(path: string, body?: object): request.Test;
  patch(path: string, body?: object): request.Test;
  delete(path: string): request.Test;
  refreshCsrf(): Promise<void>;
}

export async function apiClient(app: Express): Promise<ApiClient> {
  const agent = request.agent(app);
  const client: ApiClient = {
    agent,
    csrfToken: '',
    get: (path) => agent.get(path),
    post: (path, body) => withToken(agent.post(path), body),
    put: (path, body) => withToken(agent.put(path), body),
    patch: (path, body) => withToken(agent.patch(path), body),
    delete: (path) => agent.delete(path).set('X-CSRF-Token', client.csrfToken),
    async refreshCsrf() {
      const res = await agent.get('/api/auth/csrf').expect(200);
      client.csrfToken = res.body.csrfToken;
    },
  };
  const withToken = (test: request.Test, body?: object) => {
    const t = test.set('X-CSRF-Token', client.csrfToken);
    return body === undefined ? t : t.send(body);
  };
  await client.refreshCsrf();
  return client;
}

/** A client signed in as the given e-mail (password defaults to the test password). */
export async function signedInClient(app: Express, email: string, password = defaultTestPassword): Promise<ApiClient> {
  const client = await apiClient(app);
  const res = await client.post('/api/auth/login', { email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  client.csrfToken = res.body.csrfToken;
  return client;
}
