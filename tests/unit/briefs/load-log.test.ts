import { describe, expect, test } from 'vitest';
import { MAX_LOAD_LOG_SAMPLES, PLOT_POINTS, reduceLoadLog, type LoadSummary } from '../../../src/lib/briefs/load-log';

function summaryOf(text: string): LoadSummary {
  const result = reduceLoadLog(text);
  if (!result.ok) throw new Error(`expected a summary, got: ${result.message}`);
  return result.summary;
}

function messageOf(text: string): string {
  const result = reduceLoadLog(text);
  if (result.ok) throw new Error('expected a refusal, got a summary');
  return result.message;
}

describe('load-log reduction against a hand-computed log', () => {
  /*
   * t = 0, 1, 2, 4 s; i = 0.1, 0.3, 0.1, 0.1 A; duration 4 s.
   * Trapezoids of i:  (0.1+0.3)/2·1 = 0.2, (0.3+0.1)/2·1 = 0.2, (0.1+0.1)/2·2 = 0.2 → 0.6 A·s
   *   mean = 0.6 / 4 = 0.15 A   (the plain sample mean happens to be 0.15 too; the next log
   *   is one where the two differ)
   * Trapezoids of i²: (0.01+0.09)/2·1 = 0.05, 0.05, (0.01+0.01)/2·2 = 0.02 → 0.12 A²·s
   *   RMS = √(0.12 / 4) = √0.03 = 0.173205… A
   * Peak 0.3 A, minimum 0.1 A.
   */
  const log = 'time (s),current (A)\n0,0.1\n1,0.3\n2,0.1\n4,0.1\n';

  test('gives samples, duration, minimum, time-weighted mean and RMS, and peak', () => {
    const s = summaryOf(log);
    expect(s.samples).toBe(4);
    expect(s.durationS).toBe(4);
    expect(s.iMinA).toBe(0.1);
    expect(s.iTypA).toBeCloseTo(0.15, 12);
    expect(s.iRmsA).toBeCloseTo(Math.sqrt(0.03), 12);
    expect(s.iMaxA).toBe(0.3);
    expect(s.points).toEqual([
      [0, 0.1],
      [1, 0.3],
      [2, 0.1],
      [4, 0.1],
    ]);
  });

  test('weights by time, not by sample: a long quiet stretch pulls the mean down', () => {
    /*
     * t = 0, 1, 10 s; i = 1, 1, 0 A.
     * Area: (1+1)/2·1 = 1, (1+0)/2·9 = 4.5 → 5.5 A·s over 10 s → mean 0.55 A (sample mean 0.667).
     * i²:   (1+1)/2·1 = 1, (1+0)/2·9 = 4.5 → 5.5 A²·s → RMS √0.55 = 0.741620… A
     */
    const s = summaryOf('0,1\n1,1\n10,0\n');
    expect(s.iTypA).toBeCloseTo(0.55, 12);
    expect(s.iRmsA).toBeCloseTo(Math.sqrt(0.55), 12);
    expect(s.iMinA).toBe(0);
  });

  test('units in the header scale the values: milliamperes and milliseconds', () => {
    // The same log as above written as 0, 1000, 2000, 4000 ms and 100, 300, 100, 100 mA.
    const s = summaryOf('t [ms];I [mA]\n0;100\n1000;300\n2000;100\n4000;100\n');
    expect(s.durationS).toBeCloseTo(4, 12);
    expect(s.iTypA).toBeCloseTo(0.15, 12);
    expect(s.iRmsA).toBeCloseTo(Math.sqrt(0.03), 12);
    expect(s.iMaxA).toBeCloseTo(0.3, 12);
  });

  test.each([
    ['current (mA)', 1e-3],
    ['I [A]', 1],
    ['mA', 1e-3],
    ['current_uA', 1e-6],
    ['I (µA)', 1e-6],
    ['current', 1],
  ])('a current header "%s" scales by %s', (header, scale) => {
    expect(summaryOf(`time,${header}\n0,2\n1,2\n`).iMaxA).toBeCloseTo(2 * scale, 15);
  });

  test.each([
    ['time (s)', 1],
    ['t [ms]', 1e-3],
    ['time_us', 1e-6],
    ['µs', 1e-6],
  ])('a time header "%s" scales by %s', (header, scale) => {
    expect(summaryOf(`${header},current (A)\n0,1\n5,1\n`).durationS).toBeCloseTo(5 * scale, 15);
  });

  test('finds the columns by their headers, whatever their order, and ignores others', () => {
    const s = summaryOf('voltage (V),current (mA),time (ms)\n3.3,100,0\n3.3,300,1000\n');
    expect(s.durationS).toBeCloseTo(1, 12);
    expect(s.iMaxA).toBeCloseTo(0.3, 12);
  });

  test('tab separators, CRLF line ends, a byte-order mark, blank and comment lines', () => {
    const s = summaryOf('\uFEFF# logger export\r\ntime\tcurrent\r\n\r\n0\t0.5\r\n2\t0.5\r\n');
    expect(s.samples).toBe(2);
    expect(s.iTypA).toBeCloseTo(0.5, 12);
  });

  test('times may start anywhere; the plot counts from the first sample', () => {
    const s = summaryOf('-1,0.2\n1,0.2\n');
    expect(s.durationS).toBe(2);
    expect(s.points[0]).toEqual([0, 0.2]);
  });

  test('a long log is thinned to at most 400 points and its short peak survives', () => {
    const rows = Array.from({ length: 10_000 }, (_, k) => `${k * 0.001},${k === 5_123 ? 2.5 : 0.05}`);
    const s = summaryOf(rows.join('\n'));
    expect(s.samples).toBe(10_000);
    expect(s.points.length).toBeLessThanOrEqual(PLOT_POINTS);
    expect(s.points.length).toBeGreaterThan(PLOT_POINTS / 2);
    expect(s.points.map(([, i]) => i)).toContain(2.5);
    const times = s.points.map(([t]) => t);
    expect([...times].sort((a, b) => a - b)).toEqual(times);
  });
});

describe('load-log refusals say what is wrong and where', () => {
  test.each([
    ['an empty file', '', 'The file has no numbers'],
    ['a header only', 'time,current\n', 'The file has no numbers'],
    ['one column', '0.1\n0.2\n', 'only one column'],
    ['one sample', 'time,current\n0,0.1\n', 'only one sample'],
    ['a word in a cell', 'time,current\n0,0.1\n1,high\n', 'Row 3: the current "high" is not a number.'],
    ['a bad time on the first row', 'zero,0.1\n1,0.2\n', 'Row 1: the time "zero" is not a number.'],
    ['a missing cell', '0,0.1\n1,\n', 'Row 2: the current cell is empty.'],
    ['a short row', '0,0.1\n1\n', 'Row 2 has 1 column'],
    [
      'a decimal comma',
      'time;current\n0;0,1\n1;0,2\n',
      'Row 2: the current "0,1" uses a decimal comma; write decimals with a point, e.g. 0.1.',
    ],
    ['a time going backwards', '0,0.1\n2,0.1\n1,0.1\n', "Row 3: the time 1 is earlier than the previous row's (a negative time step)"],
    ['a repeated time', '0,0.1\n1,0.1\n1,0.2\n', "Row 3: the time 1 repeats the previous row's"],
    ['a negative current', '0,0.1\n1,-0.2\n', 'Row 2: the current -0.2 is negative'],
    [
      'an unknown current unit',
      'time (s),current (V)\n0,1\n1,1\n',
      'The current column\'s header "current (V)" gives the unit "V"; use A, mA, uA or nA.',
    ],
    ['an unknown time unit', 'time (days),current (A)\n0,1\n1,1\n', 'The time column\'s header "time (days)" gives the unit "days"'],
    ['a number too large', '0,1e400\n1,1\n', 'Row 1: the current "1e400" is too large.'],
    ['an unclosed quote', '0,0.1\n1,"0.2\n', 'Row 2 could not be read'],
  ])('%s', (_case, text, expected) => {
    expect(messageOf(text)).toContain(expected);
  });

  test(`more than ${MAX_LOAD_LOG_SAMPLES} samples is refused without reading on`, () => {
    const text = Array.from({ length: MAX_LOAD_LOG_SAMPLES + 1 }, (_, k) => `${k},1`).join('\n');
    expect(messageOf(text)).toBe('The log has more than 1,000,000 samples; thin it out or upload a shorter stretch.');
  });
});
