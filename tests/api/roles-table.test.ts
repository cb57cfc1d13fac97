import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { approvedSet, newSubstance, syntheticB2Csv } from './approved-set';
import { EMAIL, startTestApp, TEST_PASSWORD, type TestApp } from './test-app';

/**
 * Walks the roles table of README.md (section "Roles") against the running API: every row, as each demo
 * person (one role each). A ✓ must get past the role check (any answer but 401/403), a — must be refused
 * with 403, "own" is tried on the modeller's own work (allowed) and on another modeller's (403), "published"
 * on a published item (allowed) and an unpublished one (404). Bodies are empty or harmless, so an allowed
 * write mostly stops at validation (400), a missing id (404) or a state rule (409): the role check runs first.
 * The table must also list exactly the routes the app serves.
 */

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const ROLES = ['admin', 'modeller', 'reviewer', 'consumer'] as const;
type Role = (typeof ROLES)[number];
type Cell = '✓' | '—' | 'own' | 'published';
interface Row {
  route: string;
  cells: Record<Role, Cell>;
}

function readRolesTable(): Row[] {
  const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
  const section = readme.slice(readme.indexOf('\n## Roles\n'));
  const rows: Row[] = [];
  for (const line of section.split('\n')) {
    const m = /^\| `([A-Z]+ \/api\/[^`]+)` \|([^|]+)\|([^|]+)\|([^|]+)\|([^|]+)\|/.exec(line);
    if (!m) continue;
    const cells = m.slice(2, 6).map((c) => c.trim()) as Cell[];
    for (const c of cells) expect(['✓', '—', 'own', 'published'], `${m[1]}: cell "${c}"`).toContain(c);
    rows.push({ route: m[1], cells: { admin: cells[0], modeller: cells[1], reviewer: cells[2], consumer: cells[3] } });
  }
  return rows;
}

const NONE = 999999;
interface Ids {
  substance: number;
  publishedSet: number;
  publishedFit: number;
  draftSet: number;
  draftFit: number;
  modellerMeasurementSet: number;
  otherDraftSet: number;
  otherFit: number;
  otherMeasurementSet: number;
  consumerUser: string;
  approvedPairSet: number;
  pairSetInReview: number;
}
interface Probe {
  /** The path for ✓ and —. */
  path: (ids: Ids) => string;
  body?: object;
  /** For "own": the modeller's own item and another modeller's. */
  own?: (ids: Ids) => { mine: string; others: string };
  /** For "published": a published item and an unpublished one. */
  published?: (ids: Ids) => { published: string; unpublished: string };
  /** Use a freshly signed-in agent (the request ends its session). */
  fresh?: boolean;
}

const PROBES: Record<string, Probe> = {
  'GET /api/health': { path: () => '/api/health' },
  'GET /api/schemas/:name': { path: () => '/api/schemas/parameter-set-1.json' },
  'GET /api/openapi.json': { path: () => '/api/openapi.json' },
  'POST /api/auth/login': { path: () => '/api/auth/login' },
  'POST /api/auth/logout': { path: () => '/api/auth/logout', fresh: true },
  'GET /api/me': { path: () => '/api/me' },
  'POST /api/me/password': { path: () => '/api/me/password' },
  'GET /api/me/preferences': { path: () => '/api/me/preferences' },
  'PUT /api/me/preferences': { path: () => '/api/me/preferences', body: { units: 'not-a-unit-set' } },
  'GET /api/notices': { path: () => '/api/notices' },
  'POST /api/notices/:id/read': { path: () => `/api/notices/${NONE}/read` },
  'GET /api/workbench/needs-action': { path: () => '/api/workbench/needs-action' },
  'GET /api/tokens': { path: () => '/api/tokens' },
  'POST /api/tokens': { path: () => '/api/tokens', body: { name: '' } },
  'DELETE /api/tokens/:id': { path: () => `/api/tokens/${NONE}` },
  'GET /api/catalog': { path: () => '/api/catalog' },
  'GET /api/catalog/:id': { path: (i) => `/api/catalog/${i.publishedSet}` },
  'GET /api/parameter-sets/:id/export': {
    path: (i) => `/api/parameter-sets/${i.publishedSet}/export?format=json`,
    published: (i) => ({
      published: `/api/parameter-sets/${i.publishedSet}/export?format=json`,
      unpublished: `/api/parameter-sets/${i.draftSet}/export?format=json`,
    }),
  },
  'GET /api/parameter-sets/:id/predictions': {
    path: (i) => `/api/parameter-sets/${i.publishedSet}/predictions?kind=b2&temperaturesK=300`,
    published: (i) => ({
      published: `/api/parameter-sets/${i.publishedSet}/predictions?kind=b2&temperaturesK=300`,
      unpublished: `/api/parameter-sets/${i.draftSet}/predictions?kind=b2&temperaturesK=300`,
    }),
  },
  'GET /api/mixtures': { path: (i) => `/api/mixtures?sets=${i.publishedSet}&rule=lorentz-berthelot` },
  'GET /api/substances': { path: () => '/api/substances' },
  'GET /api/substances/:id': { path: (i) => `/api/substances/${i.substance}` },
  'POST /api/substances': { path: () => '/api/substances' },
  'PATCH /api/substances/:id': { path: (i) => `/api/substances/${i.substance}` },
  'POST /api/substances/:id/follow': { path: (i) => `/api/substances/${i.substance}/follow` },
  'DELETE /api/substances/:id/follow': { path: (i) => `/api/substances/${i.substance}/follow` },
  'GET /api/me/follows': { path: () => '/api/me/follows' },
  'GET /api/measurement-sets': { path: () => '/api/measurement-sets' },
  'GET /api/measurement-sets/:id': { path: (i) => `/api/measurement-sets/${i.modellerMeasurementSet}` },
  'GET /api/measurement-sets/:id/versions/:version/original': {
    path: (i) => `/api/measurement-sets/${i.modellerMeasurementSet}/versions/1/original`,
  },
  'POST /api/measurement-sets': { path: () => '/api/measurement-sets' },
  'POST /api/measurement-sets/:id/versions': {
    path: (i) => `/api/measurement-sets/${i.modellerMeasurementSet}/versions`,
    own: (i) => ({
      mine: `/api/measurement-sets/${i.modellerMeasurementSet}/versions`,
      others: `/api/measurement-sets/${i.otherMeasurementSet}/versions`,
    }),
  },
  'POST /api/measurement-sets/:id/withdraw': {
    path: (i) => `/api/measurement-sets/${i.modellerMeasurementSet}/withdraw`,
    own: (i) => ({
      mine: `/api/measurement-sets/${i.modellerMeasurementSet}/withdraw`,
      others: `/api/measurement-sets/${i.otherMeasurementSet}/withdraw`,
    }),
  },
  'POST /api/fits': { path: () => '/api/fits' },
  'GET /api/fits/:id': {
    path: (i) => `/api/fits/${i.draftFit}`,
    published: (i) => ({ published: `/api/fits/${i.publishedFit}`, unpublished: `/api/fits/${i.draftFit}` }),
  },
  'GET /api/substances/:id/fits': { path: (i) => `/api/substances/${i.substance}/fits` },
  'POST /api/fits/:id/cancel': {
    path: (i) => `/api/fits/${i.draftFit}/cancel`,
    own: (i) => ({ mine: `/api/fits/${i.draftFit}/cancel`, others: `/api/fits/${i.otherFit}/cancel` }),
  },
  'GET /api/simulations': { path: () => '/api/simulations' },
  'GET /api/simulations/queue': { path: () => '/api/simulations/queue' },
  'GET /api/simulations/:id': { path: () => `/api/simulations/${NONE}` },
  'POST /api/simulations': { path: () => '/api/simulations' },
  'POST /api/simulations/from-measurement-set': { path: () => '/api/simulations/from-measurement-set' },
  'POST /api/simulations/:id/cancel': { path: () => `/api/simulations/${NONE}/cancel` },
  'POST /api/simulations/:id/retry': { path: () => `/api/simulations/${NONE}/retry` },
  'GET /api/parameter-sets': { path: () => '/api/parameter-sets' },
  'GET /api/substances/:id/parameter-sets': { path: (i) => `/api/substances/${i.substance}/parameter-sets` },
  'GET /api/parameter-sets/:id': {
    path: (i) => `/api/parameter-sets/${i.draftSet}`,
    published: (i) => ({ published: `/api/parameter-sets/${i.publishedSet}`, unpublished: `/api/parameter-sets/${i.draftSet}` }),
  },
  'GET /api/parameter-sets/:id/diff': {
    path: (i) => `/api/parameter-sets/${i.draftSet}/diff`,
    published: (i) => ({ published: `/api/parameter-sets/${i.publishedSet}/diff`, unpublished: `/api/parameter-sets/${i.draftSet}/diff` }),
  },
  'GET /api/parameter-sets/:id/manifest': {
    path: (i) => `/api/parameter-sets/${i.draftSet}/manifest`,
    published: (i) => ({
      published: `/api/parameter-sets/${i.publishedSet}/manifest`,
      unpublished: `/api/parameter-sets/${i.draftSet}/manifest`,
    }),
  },
  'GET /api/parameter-sets/:id/rerun': {
    path: (i) => `/api/parameter-sets/${i.draftSet}/rerun`,
    published: (i) => ({
      published: `/api/parameter-sets/${i.publishedSet}/rerun`,
      unpublished: `/api/parameter-sets/${i.draftSet}/rerun`,
    }),
  },
  'POST /api/parameter-sets': { path: () => '/api/parameter-sets' },
  'PATCH /api/parameter-sets/:id': {
    path: (i) => `/api/parameter-sets/${i.draftSet}`,
    body: { rationale: 'Fits the synthetic B2 table within its uncertainty; wording checked.' },
    own: (i) => ({ mine: `/api/parameter-sets/${i.draftSet}`, others: `/api/parameter-sets/${i.otherDraftSet}` }),
  },
  'POST /api/parameter-sets/:id/submit': {
    path: (i) => `/api/parameter-sets/${i.draftSet}/submit`,
    own: (i) => ({ mine: `/api/parameter-sets/${i.draftSet}/submit`, others: `/api/parameter-sets/${i.otherDraftSet}/submit` }),
  },
  'POST /api/parameter-sets/:id/revise': { path: () => `/api/parameter-sets/${NONE}/revise` },
  'POST /api/parameter-sets/:id/review': { path: () => `/api/parameter-sets/${NONE}/review` },
  'POST /api/parameter-sets/:id/retire': { path: () => `/api/parameter-sets/${NONE}/retire` },
  'POST /api/parameter-sets/:id/comments': { path: (i) => `/api/parameter-sets/${i.publishedSet}/comments` },
  'GET /api/review-queue': { path: () => '/api/review-queue' },
  'GET /api/people': { path: () => '/api/people' },
  'POST /api/people': { path: () => '/api/people' },
  'PATCH /api/people/:id': { path: (i) => `/api/people/${i.consumerUser}` },
  'GET /api/audit': { path: () => '/api/audit' },
  'GET /api/audit/vocabulary': { path: () => '/api/audit/vocabulary' },
  'GET /api/mailbox': { path: () => '/api/mailbox' },
  'GET /api/mail/outbox': { path: () => '/api/mail/outbox' },
  'GET /api/admin/validation-suite': { path: () => '/api/admin/validation-suite' },
  'GET /api/pair-sets': { path: () => '/api/pair-sets' },
  'GET /api/pair-sets/:id': {
    path: (i) => `/api/pair-sets/${i.pairSetInReview}`,
    published: (i) => ({ published: `/api/pair-sets/${i.approvedPairSet}`, unpublished: `/api/pair-sets/${i.pairSetInReview}` }),
  },
  'POST /api/pair-sets': { path: () => '/api/pair-sets' },
  'POST /api/pair-sets/:id/review': { path: () => `/api/pair-sets/${NONE}/review` },
};

let t: TestApp;
let people: Record<Role, Agent>;
let ids: Ids;
const OTHER_MODELLER = 'hollis.wren@quillmoor.example';

beforeAll(async () => {
  t = await startTestApp();
  const admin = await t.signIn(EMAIL.admin);
  expect(
    (await admin.post('/api/people').send({ email: OTHER_MODELLER, name: 'Hollis Wren', roles: ['modeller'], password: TEST_PASSWORD }))
      .status,
  ).toBe(201);
  const [modeller, reviewer, consumer, other] = await Promise.all([
    t.signIn(EMAIL.modeller),
    t.signIn(EMAIL.reviewer),
    t.signIn(EMAIL.consumer),
    t.signIn(OTHER_MODELLER),
  ]);
  people = { admin, modeller, reviewer, consumer };
  const substance = await newSubstance(modeller, 'norrane N-7', 72.2);
  const published = await approvedSet(t, { modeller, reviewer }, { substanceId: substance, epsilonK: 240, sigmaAngstrom: 4.1 });
  const draftOf = async (agent: Agent, name: string) => {
    const up = await agent
      .post('/api/measurement-sets')
      .field('substanceId', substance)
      .field('kind', 'b2')
      .field('name', name)
      .field('source', 'Fenwick Thermophysics Laboratory, invented run')
      .attach('file', syntheticB2Csv(236, 4.12, 0.4), { filename: 'b2.csv', contentType: 'text/csv' });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const fit = await agent.post('/api/fits').send({ substanceId: substance, measurementSets: [{ id: up.body.id }] });
    expect(fit.status).toBe(202);
    expect((await t.ctx.jobs.waitFor(fit.body.jobId)).status).toBe('succeeded');
    const set = await agent
      .post('/api/parameter-sets')
      .send({ fitId: fit.body.id, rationale: 'Fits the synthetic B2 table within its uncertainty.' });
    expect(set.status, JSON.stringify(set.body)).toBe(201);
    return { measurementSet: up.body.id as number, fit: fit.body.id as number, set: set.body.id as number };
  };
  const mine = await draftOf(modeller, 'Norrane B2, second run');
  const theirs = await draftOf(other, 'Norrane B2, Hollis run');
  const consumerUser = await t.ctx.db.selectFrom('user').select('id').where('email', '=', EMAIL.consumer).executeTakeFirstOrThrow();
  // Two pair sets of the published set and a second substance's: one approved, one waiting for review.
  const partner = await approvedSet(
    t,
    { modeller, reviewer },
    { substanceId: await newSubstance(modeller, 'quillgas QG-4', 44.6), epsilonK: 150, sigmaAngstrom: 3.6 },
  );
  const b12 = ['T (K),B12 (cm3/mol),u(B12) (cm3/mol)', '200,-160.2,2', '260,-101.5,2', '330,-66.3,2', '420,-40.8,2', '520,-24.9,2'].join(
    '\n',
  );
  const up = await modeller
    .post('/api/measurement-sets')
    .field('substanceId', substance)
    .field('kind', 'b12')
    .field('name', 'Invented B12 of norrane and quillgas')
    .field('source', 'Fenwick Thermophysics Laboratory, invented run')
    .attach('file', Buffer.from(b12), { filename: 'b12.csv', contentType: 'text/csv' });
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const pairSet = async () => {
    const res = await modeller
      .post('/api/pair-sets')
      .send({ parameterSetIds: [published.setId, partner.setId], measurementSetId: up.body.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.id as number;
  };
  const approvedPairSet = await pairSet();
  expect(
    (
      await reviewer
        .post(`/api/pair-sets/${approvedPairSet}/review`)
        .send({ decision: 'approve', comment: 'B12 residuals within uncertainty.' })
    ).status,
  ).toBe(200);
  const pairSetInReview = await pairSet();
  ids = {
    substance,
    publishedSet: published.setId,
    publishedFit: published.fitId,
    draftSet: mine.set,
    draftFit: mine.fit,
    modellerMeasurementSet: mine.measurementSet,
    otherDraftSet: theirs.set,
    otherFit: theirs.fit,
    otherMeasurementSet: theirs.measurementSet,
    consumerUser: consumerUser.id,
    approvedPairSet,
    pairSetInReview,
  };
}, 120_000);
afterAll(() => t.close());

async function send(agent: Agent, method: string, path: string, body: object | undefined) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const req = agent[m](path);
  return m === 'get' ? req : req.send(body ?? {});
}

describe('README roles table', () => {
  const rows = readRolesTable();

  it('lists exactly the routes the app serves', () => {
    const served: string[] = [];
    const walk = (stack: Array<{ route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: unknown[] } }>) => {
      for (const layer of stack) {
        if (layer.route)
          for (const method of Object.keys(layer.route.methods)) served.push(`${method.toUpperCase()} /api${layer.route.path}`);
        else if (layer.handle?.stack) walk(layer.handle.stack as typeof stack);
      }
    };
    walk((t.app as unknown as { router: { stack: Parameters<typeof walk>[0] } }).router.stack);
    expect(rows.map((r) => r.route).sort()).toEqual([...new Set(served)].sort());
    expect(Object.keys(PROBES).sort()).toEqual(rows.map((r) => r.route).sort());
  });

  it.each(rows.map((r) => [r.route, r] as const))('%s', async (route, row) => {
    const probe = PROBES[route];
    const method = route.split(' ')[0];
    for (const role of ROLES) {
      const cell = row.cells[role];
      const agent = probe.fresh ? await t.signIn(EMAIL[role]) : people[role];
      const label = `${route} as ${role} (${cell})`;
      if (cell === '—') {
        const res = await send(agent, method, probe.path(ids), probe.body);
        expect(res.status, `${label}: ${JSON.stringify(res.body)}`).toBe(403);
      } else if (cell === '✓') {
        const res = await send(agent, method, probe.path(ids), probe.body);
        expect([401, 403], `${label}: ${res.status} ${JSON.stringify(res.body)}`).not.toContain(res.status);
      } else if (cell === 'own') {
        expect(role, `${route}: "own" is checked for the modeller`).toBe('modeller');
        const { mine, others } = probe.own!(ids);
        const refused = await send(agent, method, others, probe.body);
        expect(refused.status, `${label} on another modeller's: ${JSON.stringify(refused.body)}`).toBe(403);
        const allowed = await send(agent, method, mine, probe.body);
        expect([401, 403, 404], `${label} on own: ${allowed.status} ${JSON.stringify(allowed.body)}`).not.toContain(allowed.status);
      } else {
        const { published, unpublished } = probe.published!(ids);
        const allowed = await send(agent, method, published, probe.body);
        expect([401, 403, 404], `${label} published: ${allowed.status} ${JSON.stringify(allowed.body)}`).not.toContain(allowed.status);
        const hidden = await send(agent, method, unpublished, probe.body);
        expect(hidden.status, `${label} unpublished: ${JSON.stringify(hidden.body)}`).toBe(404);
      }
    }
  });
});
