/**
 * `npm run bench` — the product's figures in one run, as a table;
 * `npm run bench -- --json` also prints them as one JSON object on the last line.
 * Budgets from docs/quality.md are checked; a missed one makes the exit code 1.
 */
import { loadBundledEngineBench } from './engine-bundle';
import { evaluateRate, loadRun } from './http';
import { pageJsGzipBytes } from './js-budget';
import { pdfMedianMs } from './pdf';
import { lighthouseScores, type PageScore } from './lighthouse';
import { signedInCookie, startBenchServer } from './server';

const wantJson = process.argv.includes('--json');
const skipLighthouse = process.argv.includes('--no-lighthouse');
const log = (line: string) => console.error(line);

log('Engine, in-process (bundled as the server runs it)…');
const { engineMc100kMs, engineMedianMs, engineRuns } = await loadBundledEngineBench();
const engineMs = engineMedianMs();
const mc100kMs = engineMc100kMs();

log('Starting the built server…');
const server = await startBenchServer();
interface Results {
  engineMedianMs: number;
  engineMc100kMs: number;
  engineRatePerS: number;
  httpRatePerS: number;
  httpToEngineRatio: number;
  maxIslandJsGzipKb: number;
  publicPageJsKb: number;
  pageJsGzipKb: Record<string, number>;
  pdfMedianMs: number;
  lighthouse: PageScore[];
  loadRequests: number;
  loadRps: number;
  loadErrors: number;
  loadNon2xx: number;
  loadP99Ms: number;
}
let results: Results | null = null;
try {
  const base = server.baseUrl;
  const engineerCookie = await signedInCookie(base, 'engineer@demo.railwright.test');
  const clientCookie = await signedInCookie(base, 'client@demo.railwright.test');
  const briefs = (await (await fetch(`${base}/api/v1/briefs?state=submitted`, { headers: { cookie: engineerCookie } })).json()) as {
    items: { id: string }[];
  };
  const reviewId = briefs.items[0]?.id;

  log('JavaScript per page…');
  const pages: { name: string; path: string; cookie?: string; public: boolean }[] = [
    { name: 'front', path: '/', public: true },
    { name: 'sign-in', path: '/sign-in', public: true },
    { name: 'sign-up', path: '/sign-up', public: true },
    { name: 'forgot-password', path: '/forgot-password', public: true },
    { name: 'wizard', path: '/briefs/new', public: false },
    { name: 'client home', path: '/briefs', cookie: clientCookie, public: false },
    { name: 'desk', path: '/desk', cookie: engineerCookie, public: false },
    ...(reviewId ? [{ name: 'review', path: `/desk/briefs/${reviewId}`, cookie: engineerCookie, public: false }] : []),
  ];
  const jsKb: Record<string, number> = {};
  for (const page of pages) {
    const response = await fetch(`${base}${page.path}`, { headers: page.cookie ? { cookie: page.cookie } : {} });
    jsKb[page.name] = response.ok ? pageJsGzipBytes(await response.text()) / 1024 : Number.NaN;
  }
  const publicPageJsKb = Math.max(...pages.filter((p) => p.public).map((p) => jsKb[p.name] ?? 0));
  const maxIslandJsGzipKb = Math.max(...Object.values(jsKb).filter(Number.isFinite));

  log('Quote PDF, warm…');
  const pdfMs = await pdfMedianMs(server.databaseUrl);

  log('Evaluate route against the in-process engine, interleaved (concurrency 2)…');
  const { inProcessRate, http } = await interleavedRates(base);

  let lighthouse: PageScore[] = [];
  if (!skipLighthouse) {
    log('Lighthouse…');
    lighthouse = await lighthouseScores([
      { name: 'front', url: `${base}/` },
      { name: 'wizard', url: `${base}/briefs/new` },
      ...(reviewId ? [{ name: 'review', url: `${base}/desk/briefs/${reviewId}`, cookie: engineerCookie }] : []),
    ]);
  }

  log('Load: 200 connections, 20 s…');
  const load = await loadRun(base, clientCookie);

  results = {
    engineMedianMs: round(engineMs, 3),
    engineMc100kMs: round(mc100kMs, 3),
    engineRatePerS: round(inProcessRate, 1),
    httpRatePerS: round(http.rate, 1),
    httpToEngineRatio: round(http.rate / inProcessRate, 3),
    maxIslandJsGzipKb: round(maxIslandJsGzipKb, 1),
    publicPageJsKb: round(publicPageJsKb, 1),
    pdfMedianMs: round(pdfMs, 1),
    pageJsGzipKb: Object.fromEntries(Object.entries(jsKb).map(([k, v]) => [k, round(v, 1)])),
    lighthouse,
    loadRequests: load.requests,
    loadRps: round(load.rps, 0),
    loadErrors: load.errors + load.fivexx,
    loadNon2xx: load.non2xx,
    loadP99Ms: load.p99Ms,
  };
} finally {
  await server.stop();
}

/**
 * The machine's speed drifts from second to second, so the two rates are taken
 * in alternating short windows and summed, not one after the other. The server
 * runs the engine on one thread (ENGINE_THREADS=1), as this process does.
 */
async function interleavedRates(base: string, rounds = 6, seconds = 2) {
  await evaluateRate(base, 2); // warm-up
  engineRuns(1);
  let evaluations = 0;
  const http = { requests: 0, errors: 0, non2xx: 0 };
  for (let i = 0; i < rounds; i++) {
    evaluations += engineRuns(seconds);
    const window = await evaluateRate(base, seconds);
    http.requests += window.requests;
    http.errors += window.errors;
    http.non2xx += window.non2xx;
  }
  if (http.errors + http.non2xx > 0)
    throw new Error(`The evaluate route failed ${http.errors + http.non2xx} times during the throughput run.`);
  const total = rounds * seconds;
  return { inProcessRate: evaluations / total, http: { ...http, rate: http.requests / total } };
}

function round(x: number, digits: number): number {
  return Number.isFinite(x) ? Number(x.toFixed(digits)) : -1;
}

if (!results) throw new Error('The benchmark did not finish.');
const r: Results = results;
const budgets: [string, string, boolean][] = [
  ['engine, one full evaluation (median)', `${r.engineMedianMs} ms  (< 5)`, r.engineMedianMs < 5],
  ['engine, 100 000 Monte Carlo draws', `${r.engineMc100kMs} ms  (< 25)`, r.engineMc100kMs < 25],
  [
    'evaluate over HTTP / in-process rate',
    `${r.httpToEngineRatio}  (${r.httpRatePerS}/s vs ${r.engineRatePerS}/s; ≥ 0.7)`,
    r.httpToEngineRatio >= 0.7,
  ],
  ['largest page JavaScript (gzip)', `${r.maxIslandJsGzipKb} KB  (< 120)`, r.maxIslandJsGzipKb < 120],
  ['quote PDF, warm (median)', `${r.pdfMedianMs} ms  (< 200)`, r.pdfMedianMs < 200],
  ['public pages JavaScript', `${r.publicPageJsKb} KB  (0)`, r.publicPageJsKb === 0],
  ['load: errors and 5xx', `${r.loadErrors}  (${r.loadRequests} requests, ${r.loadRps}/s, p99 ${r.loadP99Ms} ms; 0)`, r.loadErrors === 0],
  ...r.lighthouse.map((s): [string, string, boolean] => [
    `lighthouse ${s.page}`,
    `performance ${s.performance}, accessibility ${s.accessibility}  (≥ 95 each)`,
    (s.performance ?? 0) >= 95 && (s.accessibility ?? 0) >= 95,
  ]),
];
const width = Math.max(...budgets.map(([name]) => name.length));
console.log('\nRailwright benchmark\n');
for (const [name, figure, ok] of budgets) console.log(`${ok ? 'ok  ' : 'MISS'}  ${name.padEnd(width)}  ${figure}`);
console.log(
  `\npage JavaScript (KB gzip): ${Object.entries(r.pageJsGzipKb)
    .map(([k, v]) => `${k} ${v}`)
    .join(', ')}`,
);
if (wantJson) console.log(JSON.stringify(r));
if (budgets.some(([, , ok]) => !ok)) process.exitCode = 1;
