import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ClubInvite } from '../../../server/entities/club-invite.js';
import { ClubShare } from '../../../server/entities/club-share.js';
import { PlanComment } from '../../../server/entities/plan-comment.js';
import { Plan } from '../../../server/entities/plan.js';
import { Reading } from '../../../server/entities/reading.js';
import { ShareLink } from '../../../server/entities/share-link.js';
import { Tank } from '../../../server/entities/tank.js';
import { REPLAYED_HEADER } from '../../../server/middleware/idempotency.js';
import { replayedShareLinkSchema, createdShareLinkSchema } from '../../../shared/schemas/share.js';
import { GOOD_PASSWORD, addMember, createClub, createPlan, createTank, createUser } from '../helpers/factories.js';
import { client, sleep, useTestApp } from '../helpers/test-app.js';

/**
 * Exactly-once writes under faults (issue 11): a keyed POST whose client goes away after the
 * route wrote, and a keyed POST whose database connection dies before COMMIT. The faults are
 * injected in PostgreSQL itself, so nothing in the server knows about them:
 * - a deferred constraint trigger on idempotency_keys fires at COMMIT of a key's transaction
 *   (after the route's writes and the stored answer) and, for the keys listed in
 *   test_commit_faults, waits, ends its own backend (pg_terminate_backend), or raises an error;
 * - a trigger after INSERT on each written table waits (test_write_delays), so the client can
 *   go away while the route is still running, after its row is written.
 */
const ctx = useTestApp();
const ds = () => ctx.deps.dataSource;
const WRITTEN_TABLES = ['tanks', 'plans', 'readings', 'plan_comments', 'club_invites'];
/** A key no earlier run used (the key table outlives test runs). */
const newKey = (name: string) => `${name}-${randomUUID()}`;

beforeAll(async () => {
  await ds().query(`CREATE TABLE IF NOT EXISTS test_commit_faults (key text PRIMARY KEY, action text NOT NULL, delay_ms int NOT NULL DEFAULT 0)`);
  await ds().query(`
    CREATE OR REPLACE FUNCTION test_commit_fault() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE f record;
    BEGIN
      SELECT * INTO f FROM test_commit_faults WHERE key = NEW.key;
      IF NOT FOUND THEN RETURN NULL; END IF;
      IF f.delay_ms > 0 THEN PERFORM pg_sleep(f.delay_ms / 1000.0); END IF;
      IF f.action = 'kill' THEN
        PERFORM pg_terminate_backend(pg_backend_pid());
        PERFORM pg_sleep(5);
      ELSIF f.action = 'fail' THEN
        RAISE EXCEPTION 'injected failure at COMMIT';
      END IF;
      RETURN NULL;
    END $$`);
  await ds().query(`CREATE TABLE IF NOT EXISTS test_write_delays (table_name text PRIMARY KEY, delay_ms int NOT NULL)`);
  await ds().query(`
    CREATE OR REPLACE FUNCTION test_write_delay() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE d int;
    BEGIN
      SELECT delay_ms INTO d FROM test_write_delays WHERE table_name = TG_TABLE_NAME;
      IF FOUND THEN PERFORM pg_sleep(d / 1000.0); END IF;
      RETURN NULL;
    END $$`);
  for (const table of WRITTEN_TABLES) {
    await ds().query(`DROP TRIGGER IF EXISTS test_write_delay ON "${table}"`);
    await ds().query(`CREATE TRIGGER test_write_delay AFTER INSERT ON "${table}" FOR EACH ROW EXECUTE FUNCTION test_write_delay()`);
  }
  await ds().query(`DROP TRIGGER IF EXISTS test_commit_fault ON idempotency_keys`);
  await ds().query(
    `CREATE CONSTRAINT TRIGGER test_commit_fault AFTER UPDATE ON idempotency_keys DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION test_commit_fault()`,
  );
});

afterAll(async () => {
  if (!ds()?.isInitialized) return;
  await ds().query(`DROP TRIGGER IF EXISTS test_commit_fault ON idempotency_keys`);
  await ds().query(`DROP FUNCTION IF EXISTS test_commit_fault()`);
  await ds().query(`DROP TABLE IF EXISTS test_commit_faults`);
  for (const table of WRITTEN_TABLES) await ds().query(`DROP TRIGGER IF EXISTS test_write_delay ON "${table}"`);
  await ds().query(`DROP FUNCTION IF EXISTS test_write_delay()`);
  await ds().query(`DROP TABLE IF EXISTS test_write_delays`);
});

const delayWrites = (table: string, delayMs: number) =>
  ds().query(`INSERT INTO test_write_delays (table_name, delay_ms) VALUES ($1, $2) ON CONFLICT (table_name) DO UPDATE SET delay_ms = $2`, [table, delayMs]);
const clearWriteDelay = (table: string) => ds().query(`DELETE FROM test_write_delays WHERE table_name = $1`, [table]);

const fault = (key: string, action: 'delay' | 'kill' | 'fail', delayMs = 0) =>
  ds().query(`INSERT INTO test_commit_faults (key, action, delay_ms) VALUES ($1, $2, $3)`, [key, action, delayMs]);
const clearFault = (key: string) => ds().query(`DELETE FROM test_commit_faults WHERE key = $1`, [key]);
const storedKeys = async (key: string) => Number((await ds().query(`SELECT count(*) AS n FROM idempotency_keys WHERE key = $1`, [key]))[0].n);

type Client = ReturnType<typeof client>;
async function signedIn(email: string): Promise<Client> {
  const c = client(ctx.app);
  await c.post('/api/auth/sign-in', { email, password: GOOD_PASSWORD }).expect(200);
  return c;
}

interface Case {
  name: string;
  /** The table the create writes its row to. */
  table: string;
  /** Makes the fixture; returns who posts what, and how many rows the write made so far. */
  arrange(): Promise<{ c: Client; url: string; body: object; rows(): Promise<number> }>;
  /** E-mails this write sends (an invite: one). */
  mails?: number;
}

const cases: Case[] = [
  {
    name: 'tank',
    table: 'tanks',
    async arrange() {
      const user = await createUser(ds());
      return { c: await signedIn(user.email), url: '/api/tanks', body: { name: 'Retry reef', volumeL: 90 }, rows: () => ds().getRepository(Tank).countBy({ ownerId: user.id }) };
    },
  },
  {
    name: 'plan',
    table: 'plans',
    async arrange() {
      const user = await createUser(ds());
      const tank = await createTank(ds(), user.id);
      const body = { name: 'Neons once', startDate: '2026-04-01', events: [{ type: 'add-fish', day: 0, fish: { species: 'neon-tetra', count: 6, lengthCm: 3 } }] };
      return { c: await signedIn(user.email), url: `/api/tanks/${tank.id}/plans`, body, rows: () => ds().getRepository(Plan).countBy({ tankId: tank.id }) };
    },
  },
  {
    name: 'reading',
    table: 'readings',
    async arrange() {
      const user = await createUser(ds());
      const tank = await createTank(ds(), user.id);
      const body = { takenAt: '2026-03-01T08:00:00Z', basis: 'N', tan: 0.5, no2: 0.1 };
      return { c: await signedIn(user.email), url: `/api/tanks/${tank.id}/readings`, body, rows: () => ds().getRepository(Reading).countBy({ tankId: tank.id }) };
    },
  },
  {
    name: 'comment',
    table: 'plan_comments',
    async arrange() {
      const owner = await createUser(ds());
      const mentor = await createUser(ds());
      const club = await createClub(ds());
      await addMember(ds(), club.id, owner.id, 'member');
      await addMember(ds(), club.id, mentor.id, 'mentor');
      const tank = await createTank(ds(), owner.id);
      const plan = await createPlan(ds(), tank.id);
      const share = await ds().getRepository(ClubShare).save({ clubId: club.id, ownerId: owner.id, itemType: 'plan', itemId: plan.id });
      return {
        c: await signedIn(mentor.email),
        url: `/api/clubs/${club.id}/shares/${share.id}/comments`,
        body: { body: 'Test nitrite on days 2 and 3.' },
        rows: () => ds().getRepository(PlanComment).countBy({ shareId: share.id }),
      };
    },
  },
  {
    name: 'invite',
    table: 'club_invites',
    mails: 1,
    async arrange() {
      const organizer = await createUser(ds());
      const club = await createClub(ds());
      await addMember(ds(), club.id, organizer.id, 'organizer');
      return {
        c: await signedIn(organizer.email),
        url: `/api/clubs/${club.id}/invites`,
        body: { email: 'friend@example.org' },
        rows: () => ds().getRepository(ClubInvite).countBy({ clubId: club.id }),
      };
    },
  },
];

/**
 * E-mails sent so far, once the work left running after the answers is done. Delivery to the
 * local SMTP fake can lag the drain on a busy machine, so it waits (up to 3 s) for `expected`
 * to arrive, then 100 ms more for any that should not.
 */
async function mailsSent(expected = 0): Promise<number> {
  await ctx.deps.background.drain();
  for (let waited = 0; ctx.mail.messages().length < expected && waited < 3000; waited += 50) await sleep(50);
  await sleep(100);
  return ctx.mail.messages().length;
}

describe('a keyed POST survives its client going away and its connection dying', () => {
  describe.each(cases)('$name create', (kase) => {
    it.each(['while the route runs', 'while COMMIT runs'] as const)('client aborts after the write, %s: the route still commits and stores its answer; the retry replays it, one row', async (when) => {
      const { c, url, body, rows } = await kase.arrange();
      const key = newKey(`abort-${kase.name}`);
      // The row is written, then the route (or its COMMIT) takes 800 ms: the client is gone by then.
      if (when === 'while the route runs') await delayWrites(kase.table, 800);
      else await fault(key, 'delay', 800);
      const aborted = await c
        .post(url, body)
        .set('Idempotency-Key', key)
        .timeout(250)
        .then(
          () => 'answered',
          (err: { timeout?: number }) => (err.timeout ? 'aborted' : String(err)),
        );
      expect(aborted).toBe('aborted');
      await clearWriteDelay(kase.table);
      await clearFault(key);
      // The retry waits for the first attempt's transaction, then gets its answer.
      const retry = await c.post(url, body).set('Idempotency-Key', key).expect(201);
      expect(retry.headers[REPLAYED_HEADER.toLowerCase()]).toBe('true');
      expect(await rows()).toBe(1);
      expect(await mailsSent(kase.mails ?? 0)).toBe(kase.mails ?? 0);
    });

    it('connection killed before COMMIT: nothing written, no key kept; the retry writes once, the next replays', async () => {
      const { c, url, body, rows } = await kase.arrange();
      const key = newKey(`kill-${kase.name}`);
      await fault(key, 'kill');
      await c.post(url, body).set('Idempotency-Key', key).expect(503);
      expect(await rows()).toBe(0);
      expect(await storedKeys(key)).toBe(0);
      expect(await mailsSent()).toBe(0);
      await clearFault(key);

      const retry = await c.post(url, body).set('Idempotency-Key', key).expect(201);
      expect(retry.headers[REPLAYED_HEADER.toLowerCase()]).toBeUndefined();
      const again = await c.post(url, body).set('Idempotency-Key', key).expect(201);
      expect(again.headers[REPLAYED_HEADER.toLowerCase()]).toBe('true');
      expect(again.body).toEqual(retry.body);
      expect(await rows()).toBe(1);
      expect(await mailsSent(kase.mails ?? 0)).toBe(kase.mails ?? 0);
    });
  });

  it('a failed COMMIT leaves neither the write nor the key, and the server keeps answering', async () => {
    const { c, url, body, rows } = await cases[0]!.arrange();
    const key = newKey('fail-commit');
    await fault(key, 'fail');
    await c.post(url, body).set('Idempotency-Key', key).expect(503);
    expect(await rows()).toBe(0);
    expect(await storedKeys(key)).toBe(0);
    await clearFault(key);
    await c.post(url, body).set('Idempotency-Key', key).expect(201);
    expect(await rows()).toBe(1);
  });

  it('a logged test queues its alert check once, after COMMIT, and not for a replay', async () => {
    const { c, url, body } = await cases[2]!.arrange();
    const checks = () => ctx.logs.entries.filter((e) => e.event === 'jobs.disabled_reading_not_checked').length;
    const key = newKey('alert-kill');
    await fault(key, 'kill');
    await c.post(url, body).set('Idempotency-Key', key).expect(503);
    expect(checks()).toBe(0);
    await clearFault(key);
    await c.post(url, body).set('Idempotency-Key', key).expect(201);
    await c.post(url, body).set('Idempotency-Key', key).expect(201);
    expect(checks()).toBe(1);
  });
});

describe('answers carrying a secret are never stored', () => {
  it('a keyed share-link create shows its token once; the replay names the link without it, and the key table holds no token', async () => {
    const user = await createUser(ds());
    const tank = await createTank(ds(), user.id);
    const plan = await createPlan(ds(), tank.id);
    const c = await signedIn(user.email);
    const body = { itemType: 'plan', itemId: plan.id };
    const key = newKey('link');
    const first = createdShareLinkSchema.parse((await c.post('/api/share-links', body).set('Idempotency-Key', key).expect(201)).body);
    const token = /\/s\/([A-Za-z0-9_-]{43})$/.exec(first.url)![1]!;
    // The address works.
    await client(ctx.app).get(`/api/share/${token}`).expect(200);

    const replay = await c.post('/api/share-links', body).set('Idempotency-Key', key).expect(201);
    expect(replay.headers[REPLAYED_HEADER.toLowerCase()]).toBe('true');
    const replayed = replayedShareLinkSchema.parse(replay.body);
    expect(replayed).toEqual({ ...first, url: null, urlShownOnce: true });
    expect(JSON.stringify(replay.body)).not.toContain(token);
    // One link, revocable by the id the replay gave.
    expect(await ds().getRepository(ShareLink).countBy({ itemId: plan.id })).toBe(1);
    await c.agent.delete(`/api/share-links/${replayed.id}`).set('x-shoalshift-csrf', '1').expect(204);

    const stored: { scope: string; body: unknown }[] = await ds().query(`SELECT scope, body FROM idempotency_keys WHERE key = $1`, [key]);
    expect(stored).toHaveLength(1);
    expect(JSON.stringify(stored)).not.toContain(token);
  });

  it('a keyed invite accept keeps no invite token in the key table (the path is hashed)', async () => {
    const organizer = await createUser(ds());
    const invitee = await createUser(ds(), { email: 'joiner@example.org' });
    const club = await createClub(ds());
    await addMember(ds(), club.id, organizer.id, 'organizer');
    const org = await signedIn(organizer.email);
    await org.post(`/api/clubs/${club.id}/invites`, { email: invitee.email }).expect(201);
    await ctx.deps.background.drain();
    const mail = await ctx.mail.waitFor((m) => m.to.includes(invitee.email));
    const token = /\/invite\/([A-Za-z0-9_-]{43})/.exec(mail.text)![1]!;

    const joiner = await signedIn(invitee.email);
    const key = newKey('accept');
    await joiner.post(`/api/invites/${token}/accept`, {}).set('Idempotency-Key', key).expect(200);
    const replay = await joiner.post(`/api/invites/${token}/accept`, {}).set('Idempotency-Key', key).expect(200);
    expect(replay.headers[REPLAYED_HEADER.toLowerCase()]).toBe('true');
    const stored: unknown[] = await ds().query(`SELECT scope, body FROM idempotency_keys WHERE key = $1`, [key]);
    expect(stored).toHaveLength(1);
    expect(JSON.stringify(stored)).not.toContain(token);
  });
});

describe('one water test per tank and moment', () => {
  it('parallel unkeyed POSTs of one time: one 201, the rest 409 naming takenAt, never a 500 or a second row', async () => {
    const user = await createUser(ds());
    const tank = await createTank(ds(), user.id);
    const c = await signedIn(user.email);
    const body = { takenAt: '2026-05-01T19:00:00Z', basis: 'N', tan: 0.2 };
    const answers = await Promise.all(Array.from({ length: 6 }, () => c.post(`/api/tanks/${tank.id}/readings`, body)));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409, 409]);
    for (const a of answers.filter((x) => x.status === 409)) expect(a.body.error.fields).toHaveProperty('takenAt');
    expect(await ds().getRepository(Reading).countBy({ tankId: tank.id })).toBe(1);
  });

  it('the database refuses a second row at the same time whoever writes it', async () => {
    const user = await createUser(ds());
    const tank = await createTank(ds(), user.id);
    const row = { tankId: tank.id, takenAt: new Date('2026-05-02T19:00:00Z'), tanMgN: 0.1, basis: 'N' as const };
    await ds().getRepository(Reading).insert({ ...row });
    await expect(ds().getRepository(Reading).insert({ ...row })).rejects.toMatchObject({ code: '23505', constraint: 'readings_tank_id_taken_at_key' });
  });
});
