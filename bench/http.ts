/** HTTP figures with autocannon on loopback: the evaluate route's rate, and the load run. */
import autocannon from 'autocannon';
import { BENCH_BRIEF_INPUTS } from './briefs';

type Result = Awaited<ReturnType<typeof autocannon>>;

function run(options: autocannon.Options): Promise<Result> {
  return new Promise((resolve, reject) => {
    autocannon(options, (error, result) => (error ? reject(error) : resolve(result)));
  });
}

const evaluateRequests = BENCH_BRIEF_INPUTS.map((brief) => ({
  method: 'POST' as const,
  path: '/api/v1/evaluate',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify(brief),
}));

export async function evaluateRate(baseUrl: string, seconds: number): Promise<{ requests: number; errors: number; non2xx: number }> {
  const result = await run({ url: baseUrl, connections: 2, duration: seconds, requests: evaluateRequests });
  return { requests: result.requests.total, errors: result.errors + result.timeouts, non2xx: result.non2xx };
}

/** 200 connections for `seconds` on the front page, the evaluate route and a signed-in list. */
export async function loadRun(baseUrl: string, cookie: string, seconds = 20) {
  const result = await run({
    url: baseUrl,
    connections: 200,
    duration: seconds,
    timeout: 20,
    requests: [
      { method: 'GET', path: '/' },
      evaluateRequests[3]!,
      { method: 'GET', path: '/api/v1/briefs?pageSize=25', headers: { cookie } },
    ],
  });
  const fivexx = Object.entries(result.statusCodeStats ?? {})
    .filter(([code]) => code.startsWith('5'))
    .reduce((n, [, stat]) => n + (stat as { count: number }).count, 0);
  return {
    requests: result.requests.total,
    rps: result.requests.average,
    p99Ms: result.latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
    fivexx,
  };
}
