/** The corpus at a glance: what each brief gets, whether an engineer would accept it, and what blocks the accepted topologies. */
import { evaluate } from '../src/lib/engine/evaluate';
import { railSpecSchema } from '../src/lib/engine/rail-spec';
import { CORPUS } from '../tests/unit/engine/corpus/briefs';
import { impossibleFigures } from '../tests/unit/engine/corpus/impossible';

const only = process.argv[2];
let accepted = 0;
let clean = 0;
const byFamily = new Map<string, { n: number; ok: number }>();
for (const brief of CORPUS) {
  if (only && !brief.id.includes(only) && brief.family !== only) continue;
  const spec = railSpecSchema.parse(brief.spec);
  const result = evaluate(spec);
  const ok = result.recommended !== null && brief.accept.includes(result.recommended);
  const impossible = impossibleFigures(result, spec);
  accepted += ok ? 1 : 0;
  clean += impossible.length === 0 ? 1 : 0;
  const f = byFamily.get(brief.family) ?? { n: 0, ok: 0 };
  byFamily.set(brief.family, { n: f.n + 1, ok: f.ok + (ok ? 1 : 0) });
  console.log(
    `${ok ? 'ok  ' : 'FAIL'} ${brief.id.padEnd(30)} ${brief.family.padEnd(13)} → ${String(result.recommended).padEnd(15)} accept: ${brief.accept.join(', ')}`,
  );
  if (!ok) {
    for (const o of result.options.filter((x) => brief.accept.includes(x.topology))) {
      const blockers = o.issues.filter((i) => i.severity === 'blocker');
      console.log(
        `       ${o.topology}: ${o.feasible ? `feasible, score ${o.score} (pick scored ${result.options[0]?.score})` : blockers.map((i) => `[${i.code}] ${i.message}`).join('\n         ')}`,
      );
    }
  }
  for (const line of impossible) console.log(`       impossible: ${line}`);
}
console.log('');
for (const [family, f] of byFamily) console.log(`${family.padEnd(13)} ${f.ok}/${f.n}`);
const total = [...byFamily.values()].reduce((n, f) => n + f.n, 0);
console.log(`accepted ${accepted}/${total}; free of impossible figures ${clean}/${total}`);
