// Series resistor feeding a Zener that holds the rail.
import type { Context } from '../context.ts';
import { forced } from '../context.ts';
import { Refs, atLeast, blocker, info, makePart, operatingPoint, resistorPart, type Design, type OperatingPoint } from '../design.ts';
import { snap } from '../eseries.ts';
import { Trace } from '../trace.ts';
import type { Issue } from '../types.ts';
import { COLD_AMBIENT_C, analyseTolerance, temperatureSwingK, toleranceVerdict, type Draws } from '../tolerance.ts';
import { designShuntReference } from './shunt-reference.ts';
import { seriesFor, seriesForPower, zenerModel, zenerTempco, zenerVoltage } from '../zeners.ts';

export interface ShuntSolution {
  vOut: number;
  iZener: number;
  iSeries: number;
}

/**
 * Operating point with the Zener modelled as its knee voltage plus rz: Vz(I) = Vk + rz·I, where
 * Vk = Vz,nom − rz·Iz,test so the nominal voltage holds at the test current. With rz = 0 this is
 * the textbook Iz = (Vin − Vz)/Rs − Iout.
 */
/** Output voltage alone, without allocating (the Monte Carlo calls it per draw). */
export function shuntVout(vIn: number, iOut: number, rs: number, vKnee: number, rz: number): number {
  const iz = (vIn - vKnee - iOut * rs) / (rs + rz);
  return iz <= 0 ? Math.max(0, vIn - iOut * rs) : vKnee + rz * iz;
}

export function solveShunt(vIn: number, iOut: number, rs: number, vKnee: number, rz: number): ShuntSolution {
  const iz = (vIn - vKnee - iOut * rs) / (rs + rz);
  if (iz <= 0) {
    // The Zener starves: the load takes all the current and the output sags.
    const vOut = Math.max(0, vIn - iOut * rs);
    return { vOut, iZener: 0, iSeries: (vIn - vOut) / rs };
  }
  const vOut = vKnee + rz * iz;
  return { vOut, iZener: iz, iSeries: iz + iOut };
}

/**
 * The Zener shunt and each precision shunt reference are designed; the one with fewest blockers
 * (a tolerance the output cannot hold counts as one, and so does ripple past the rail's limit,
 * which the assembly raises on the finished design) wins, then the cheaper.
 */
export function designShunt(ctx: Context): Design {
  const { spec } = ctx;
  const band = { lo: spec.output.v * (1 - spec.output.tolerance), hi: spec.output.v * (1 + spec.output.tolerance) };
  const rule = spec.overrides.toleranceRule ?? 'statistical';
  const designs: Design[] = [designZenerShunt(ctx), ...ctx.catalog.shuntReferences.map((r) => designShuntReference(ctx, r))];
  const judged = designs.map((d, index) => {
    const spread = analyseTolerance(d.output);
    const fails = toleranceVerdict(spread, band, rule, d.rippleVpp / 2) === 'fails';
    const r = rule === 'statistical' ? spread.statistical : spread.worstCase;
    return {
      d,
      index,
      rank: d.issues.filter((i) => i.severity === 'blocker').length + (fails ? 1 : 0) + (d.rippleVpp > spec.noise.maxRippleVpp ? 1 : 0),
      // How far the output leaves the band: between two failing designs, the nearer is the better start.
      excess: Math.max(0, band.lo - r.min, r.max - band.hi),
      cost: d.parts.reduce((n, p) => n + p.costCents, 0),
    };
  });
  return judged.sort((a, b) => a.rank - b.rank || a.excess - b.excess || a.cost - b.cost || a.index - b.index)[0]!.d;
}

function designZenerShunt(ctx: Context): Design {
  const { spec, catalog } = ctx;
  const trace = new Trace();
  const issues: Issue[] = [];
  const refs = new Refs();
  const { vMax, vNom } = spec.input;
  const { iMin, iMax } = spec.output;
  const rsRef = refs.next('R');
  const dzRef = refs.next('D');

  const vz = forced(ctx, dzRef) ?? zenerVoltage(spec.output.v);
  trace.select('shunt.vz', 'Zener voltage (E24 nearest the rail)', 'Vz = E24(Vout)', { Vout: [spec.output.v, 'V'] }, vz, 'V');
  let candidates = seriesFor(catalog, vz);
  if (candidates.length === 0) {
    issues.push(blocker('zener-range', `No Zener series in the catalog offers ${vz} V.`));
    candidates = [...catalog.zenerSeries].sort((a, b) => b.vMaxV - a.vMaxV).slice(0, 1);
  }

  // Try each power series from the smallest: its knee current sets Rs, Rs sets the Zener's worst power.
  let series = candidates[0]!;
  let rs = 1;
  let pzWorst = 0;
  for (const s of candidates) {
    // Without headroom (a blocker below) Rs is sized from the highest input so the figures stay sane.
    const drop = ctx.vInTrough > vz ? ctx.vInTrough - vz : vMax > vz ? vMax - vz : vz;
    const rsIdeal = drop / (iMax + s.kneeCurrentA);
    rs = forced(ctx, rsRef) ?? snap(atLeast(rsIdeal, 1e-3), spec.overrides.resistorSeries ?? 'E24', 'down');
    const m = zenerModel(s, vz);
    const worst = solveShunt(vMax, iMin, rs, m.vKnee, m.rz);
    pzWorst = worst.vOut * worst.iZener;
    series = s;
    if (s === seriesForPower(candidates, pzWorst)) break;
  }
  const { rz, vKnee, iTest } = zenerModel(series, vz);
  const rsTolerance = spec.overrides.resistorSeries === 'E96' ? 0.01 : 0.05;

  trace.select(
    'shunt.rs',
    'Series resistor, snapped down so the Zener never starves',
    'Rs = (vInTrough − Vz) / (iOutMax + IzKnee)',
    { vInTrough: [ctx.vInTrough, 'V'], Vz: [vz, 'V'], iOutMax: [iMax, 'A'], IzKnee: [series.kneeCurrentA, 'A'] },
    rs,
    'Ω',
  );
  trace.select('shunt.rz', 'Zener dynamic impedance (typical)', 'rz = f(Vz) from the series table', { Vz: [vz, 'V'] }, rz, 'Ω');
  const worst = solveShunt(vMax, iMin, rs, vKnee, rz);
  trace.add(
    'shunt.iz',
    'Zener worst current (highest input, lightest load)',
    'Iz = max(0, (vInMax − Vk − iOutMin·Rs) / (Rs + rz))',
    { vInMax: [vMax, 'V'], Vk: [vKnee, 'V'], iOutMin: [iMin, 'A'], Rs: [rs, 'Ω'], rz: [rz, 'Ω'] },
    worst.iZener,
    'A',
  );
  trace.add('shunt.pz', 'Zener worst power', 'Pz = Vz·Iz', { Vz: [worst.vOut, 'V'], Iz: [worst.iZener, 'A'] }, pzWorst, 'W');
  trace.add(
    'shunt.prs.fault',
    'Series resistor power with the output shorted',
    'P = vInMax² / Rs',
    { vInMax: [vMax, 'V'], Rs: [rs, 'Ω'] },
    (vMax * vMax) / rs,
    'W',
  );

  if (ctx.vInTrough <= vz) {
    issues.push(
      blocker('headroom', `The lowest input (${ctx.vInTrough.toFixed(2)} V at the ripple trough) must exceed the Zener voltage ${vz} V.`),
    );
  }
  const starved = solveShunt(ctx.vInTrough, iMax, rs, vKnee, rz);
  if (starved.iZener < series.kneeCurrentA * 0.999) {
    issues.push(
      blocker(
        'zener-starved',
        `At the lowest input and highest load the Zener carries only ${(starved.iZener * 1e3).toFixed(2)} mA, below its knee.`,
      ),
    );
  }
  issues.push(
    info('light-load', 'A shunt regulator draws the same input current at every load; the Zener absorbs what the load does not take.'),
  );
  if ((vMax * vMax) / rs > 1) {
    issues.push(
      info('short-circuit', `A shorted output puts ${((vMax * vMax) / rs).toFixed(2)} W into ${rsRef}; it is rated for that case.`),
    );
  }

  const lineGain = rz / (rs + rz);
  const rippleVpp = trace.add(
    'shunt.ripple',
    'Output ripple (line regulation times input ripple)',
    'ΔVout = ΔVin · rz/(Rs + rz)',
    { ΔVin: [spec.input.rippleVpp, 'V'], rz: [rz, 'Ω'], Rs: [rs, 'Ω'] },
    spec.input.rippleVpp * lineGain,
    'V',
  );

  const parts = [
    resistorPart(rsRef, 'series-resistor', rs, rsTolerance, spec.overrides.resistorSeries ?? 'E24'),
    makePart({
      ref: dzRef,
      role: 'zener',
      part: series.label,
      value: vz,
      unit: 'V',
      ratingW: series.powerW,
      tolerance: series.tolerance,
      costCents: series.costCents,
      thermal: {
        thetaJcCW: series.thetaJaCW,
        thetaJaCW: series.thetaJaCW,
        tjMaxC: series.tjMaxC,
        heatsinkable: false,
        protectedInFault: false,
      },
    }),
  ];

  const operate = (vIn: number, iOut: number): OperatingPoint => {
    const s = solveShunt(vIn, iOut, rs, vKnee, rz);
    const vRs = vIn - s.vOut;
    return operatingPoint(s.iZener > 0, vIn * s.iSeries, s.vOut * iOut, () => ({
      [rsRef]: { w: vRs * s.iSeries, v: vRs },
      [dzRef]: { w: s.vOut * s.iZener, v: s.vOut },
    }));
  };
  const fault: OperatingPoint = {
    regulates: false,
    pInW: (vMax * vMax) / rs,
    pOutW: 0,
    stress: { [rsRef]: { w: (vMax * vMax) / rs, v: vMax }, [dzRef]: { w: 0, v: 0 } },
  };

  // Output spread: Zener tolerance, its drift over the ambient swing plus its own heating
  // (TC·ΔT, ΔT including Pz·θJA), Rs tolerance, and the line/load corners through rz.
  const zTol = series.tolerance;
  const selfRiseK = pzWorst * series.thetaJaCW;
  const zDrift = trace.add(
    'shunt.drift',
    'Zener voltage drift over temperature (ambient swing plus self-heating, |TC| from 25 °C)',
    'δ = TC·max(Ta + Pz·θJA − 25, 25 − Tcold)',
    {
      TC: [Math.abs(zenerTempco(vz)), '1/K'],
      Ta: [ctx.ambientC, '°C'],
      Pz: [pzWorst, 'W'],
      θJA: [series.thetaJaCW, 'K/W'],
      Tcold: [COLD_AMBIENT_C, '°C'],
    },
    Math.abs(zenerTempco(vz)) * temperatureSwingK(ctx.ambientC, selfRiseK),
    '',
  );
  const output = {
    params: [
      { name: 'Vz', nominal: vz, lo: vz * (1 - zTol - zDrift), hi: vz * (1 + zTol + zDrift) },
      { name: 'Rs', nominal: rs, lo: rs * (1 - rsTolerance), hi: rs * (1 + rsTolerance) },
      { name: 'vIn', nominal: vNom, lo: ctx.vInTrough, hi: vMax },
      { name: 'iOut', nominal: spec.output.iTyp, lo: iMin, hi: iMax },
    ],
    f: (x: Float64Array) => shuntVout(x[2]!, x[3]!, x[1]!, x[0]! - rz * iTest, rz),
    batch: ({ u, lo, span }: Draws, out: Float64Array) => {
      const [z, r, v, i] = u as [Float64Array, Float64Array, Float64Array, Float64Array];
      const at = (j: number, x: number) => lo[j]! + span[j]! * x;
      for (let k = 0; k < out.length; k += 1) out[k] = shuntVout(at(2, v[k]!), at(3, i[k]!), at(1, r[k]!), at(0, z[k]!) - rz * iTest, rz);
    },
  };

  const assumptions = {
    [`${dzRef}.rz`]: { value: rz, unit: 'Ω' },
    [`${dzRef}.vKnee`]: { value: vKnee, unit: 'V' },
    [`${dzRef}.iTest`]: { value: iTest, unit: 'A' },
  };
  return { topology: 'shunt', label: 'Zener shunt regulator', parts, issues, trace, operate, fault, output, rippleVpp, assumptions };
}
