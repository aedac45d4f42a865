import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../../shared/api-error.js';
import { GOOD_PASSWORD, createUser } from './factories.js';
import { client, type TestContext } from './test-app.js';

/** A signed-in keeper with every method the tank routes use (CSRF header on unsafe ones). */
export async function signedInKeeper(ctx: TestContext, email: string) {
  const user = await createUser(ctx.deps.dataSource, { email });
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  const csrf = <T extends { set(k: string, v: string): T }>(t: T) => t.set(CSRF_HEADER, CSRF_HEADER_VALUE);
  return {
    user,
    agent: c.agent,
    get: c.get,
    post: c.post,
    patch: (url: string, body: object) => csrf(c.agent.patch(url)).send(body),
    put: (url: string, body: object) => csrf(c.agent.put(url)).send(body),
    del: (url: string) => csrf(c.agent.delete(url)),
    /** Multipart upload of `text` as the form field `file`. */
    upload: (url: string, text: string | Buffer, filename = 'tests.csv', contentType = 'text/csv') =>
      csrf(c.agent.post(url)).attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8'), { filename, contentType }),
  };
}

export type Keeper = Awaited<ReturnType<typeof signedInKeeper>>;
