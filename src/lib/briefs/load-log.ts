/**
 * Reduces a CSV load log (time and current) to the figures the load step of a
 * brief needs, plus a thinned series for a small plot. Pure and browser-safe,
 * so the wizard can preview a log before it is uploaded and the server reduces
 * it the same way when it is.
 */
import Papa from 'papaparse';

export interface LoadSummary {
  samples: number;
  /** From the first sample to the last. */
  durationS: number;
  iMinA: number;
  /** Time-weighted mean (trapezoidal integral over the duration). */
  iTypA: number;
  /** Time-weighted RMS (trapezoidal integral of i² over the duration). */
  iRmsA: number;
  /** The peak sample. */
  iMaxA: number;
  /** At most PLOT_POINTS pairs of [seconds from the first sample, amperes]. */
  points: Array<[number, number]>;
}

export type LoadLogResult = { ok: true; summary: LoadSummary } | { ok: false; message: string };

export const MAX_LOAD_LOG_SAMPLES = 1_000_000;
export const PLOT_POINTS = 400;

const TIME_UNITS: Record<string, number> = {
  s: 1,
  sec: 1,
  secs: 1,
  seconds: 1,
  ms: 1e-3,
  us: 1e-6,
  µs: 1e-6,
  μs: 1e-6,
  ns: 1e-9,
  min: 60,
  h: 3600,
};
const CURRENT_UNITS: Record<string, number> = { a: 1, amp: 1, amps: 1, ma: 1e-3, ua: 1e-6, µa: 1e-6, μa: 1e-6, na: 1e-9 };
const KNOWN_UNIT = (u: string) => u in TIME_UNITS || u in CURRENT_UNITS;

const TIME_NAME = /^(t|time|timestamp|elapsed)\b/i;
const CURRENT_NAME = /^(i|current|load|amps?)\b/i;
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

const count = (n: number) => n.toLocaleString('en-US');

interface HeaderCell {
  text: string;
  name: string;
  /** Lower-cased for look-up; `unitText` keeps it as written, for messages. */
  unit: string | null;
  unitText: string;
}

/** Reads "current (mA)", "I [A]", "time_ms", "t/s" or a bare "mA" into a name and a unit. */
function readHeaderCell(raw: string): HeaderCell {
  const text = raw.trim();
  const lower = text.toLowerCase();
  if (KNOWN_UNIT(lower)) return { text, name: '', unit: lower, unitText: text };
  const bracketed = /^(.*?)[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(text);
  if (bracketed) return { text, name: bracketed[1]!.trim(), unit: bracketed[2]!.toLowerCase(), unitText: bracketed[2]! };
  const trailing = /^(.*?)[\s_/]+([a-zA-Zµμ]+)$/.exec(text);
  if (trailing && KNOWN_UNIT(trailing[2]!.toLowerCase()))
    return { text, name: trailing[1]!.trim(), unit: trailing[2]!.toLowerCase(), unitText: trailing[2]! };
  return { text, name: text, unit: null, unitText: '' };
}

type Columns = { time: number; current: number; timeScale: number; currentScale: number; timeLabel: string; currentLabel: string };

function columnsFromHeader(cells: HeaderCell[]): { ok: true; columns: Columns } | { ok: false; message: string } {
  const isTime = (c: HeaderCell) => (c.unit !== null && c.unit in TIME_UNITS) || TIME_NAME.test(c.name);
  const isCurrent = (c: HeaderCell) => (c.unit !== null && c.unit in CURRENT_UNITS) || CURRENT_NAME.test(c.name);
  const foundTime = cells.findIndex(isTime);
  const time = foundTime >= 0 ? foundTime : 0;
  const foundCurrent = cells.findIndex((c, k) => k !== time && isCurrent(c));
  const current = foundCurrent >= 0 ? foundCurrent : cells.findIndex((_, k) => k !== time);
  const timeCell = cells[time]!;
  const currentCell = cells[current]!;
  const timeScale = timeCell.unit === null ? 1 : TIME_UNITS[timeCell.unit];
  if (timeScale === undefined) {
    return {
      ok: false,
      message: `The time column's header "${timeCell.text}" gives the unit "${timeCell.unitText}"; use s, ms, us, ns, min or h.`,
    };
  }
  const currentScale = currentCell.unit === null ? 1 : CURRENT_UNITS[currentCell.unit];
  if (currentScale === undefined) {
    return {
      ok: false,
      message: `The current column's header "${currentCell.text}" gives the unit "${currentCell.unitText}"; use A, mA, uA or nA.`,
    };
  }
  return {
    ok: true,
    columns: { time, current, timeScale, currentScale, timeLabel: timeCell.text || 'time', currentLabel: currentCell.text || 'current' },
  };
}

const PLAIN_COLUMNS: Columns = { time: 0, current: 1, timeScale: 1, currentScale: 1, timeLabel: 'time', currentLabel: 'current' };

/** Tab, then semicolon, then comma: a semicolon file may use decimal commas, so a comma is the last guess. */
function delimiterOf(text: string): string {
  const firstLine = text.split(/\r\n|\n|\r/).find((line) => line.trim() !== '' && !line.trimStart().startsWith('#')) ?? '';
  if (firstLine.includes('\t')) return '\t';
  if (firstLine.includes(';')) return ';';
  return ',';
}

const isNumeric = (cell: string | undefined) => cell !== undefined && NUMBER.test(cell.trim());

/** Growable columns of numbers, so a million samples cost 16 MB and no per-row objects. */
class Series {
  t = new Float64Array(1024);
  i = new Float64Array(1024);
  length = 0;
  push(t: number, i: number) {
    if (this.length === this.t.length) {
      const grow = (a: Float64Array) => {
        const b = new Float64Array(a.length * 2);
        b.set(a);
        return b;
      };
      this.t = grow(this.t);
      this.i = grow(this.i);
    }
    this.t[this.length] = t;
    this.i[this.length] = i;
    this.length++;
  }
}

/** Parses a load log's text; on any fault, says what and where so the person can fix the file. */
function readSeries(text: string): { ok: true; series: Series } | { ok: false; message: string } {
  const series = new Series();
  let columns: Columns | null = null;
  let failure: string | null = null;
  let line = 0;

  const fail = (message: string, parser: Papa.Parser) => {
    failure = message;
    parser.abort();
  };

  Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    delimiter: delimiterOf(text),
    skipEmptyLines: false,
    step(result, parser) {
      line++;
      const row = result.data;
      if (result.errors.length > 0) return fail(`Row ${line} could not be read: ${result.errors[0]!.message}.`, parser);
      if (row.every((cell) => cell.trim() === '') || row[0]!.trimStart().startsWith('#')) return;

      if (columns === null) {
        if (row.length < 2) {
          return fail(
            'The log has only one column; it needs a time column and a current column separated by a comma, semicolon or tab.',
            parser,
          );
        }
        // A header has words in both leading cells; one number there means a data row with a bad cell.
        if (isNumeric(row[0]) || isNumeric(row[1])) {
          columns = PLAIN_COLUMNS;
        } else {
          const found = columnsFromHeader(row.map(readHeaderCell));
          if (!found.ok) return fail(found.message, parser);
          columns = found.columns;
          return;
        }
      }

      const needed = Math.max(columns.time, columns.current) + 1;
      if (row.length < needed)
        return fail(`Row ${line} has ${row.length} column${row.length === 1 ? '' : 's'}; expected a time and a current.`, parser);
      const value = (index: number, label: string, scale: number): number | string => {
        const cell = row[index]!.trim();
        if (cell === '') return `Row ${line}: the ${label} cell is empty.`;
        if (DECIMAL_COMMA.test(cell))
          return `Row ${line}: the ${label} "${cell}" uses a decimal comma; write decimals with a point, e.g. ${cell.replace(',', '.')}.`;
        if (!NUMBER.test(cell)) return `Row ${line}: the ${label} "${cell}" is not a number.`;
        const scaled = Number(cell) * scale;
        return Number.isFinite(scaled) ? scaled : `Row ${line}: the ${label} "${cell}" is too large.`;
      };
      const t = value(columns.time, columns.timeLabel, columns.timeScale);
      if (typeof t === 'string') return fail(t, parser);
      const i = value(columns.current, columns.currentLabel, columns.currentScale);
      if (typeof i === 'string') return fail(i, parser);

      if (i < 0) {
        return fail(
          `Row ${line}: the current ${row[columns.current]!.trim()} is negative; a load log records the current the load draws, which is never below zero (if the probe was reversed, flip the sign of the column).`,
          parser,
        );
      }
      if (series.length > 0) {
        const previous = series.t[series.length - 1]!;
        if (t === previous)
          return fail(
            `Row ${line}: the time ${row[columns.time]!.trim()} repeats the previous row's; times must increase from row to row.`,
            parser,
          );
        if (t < previous)
          return fail(
            `Row ${line}: the time ${row[columns.time]!.trim()} is earlier than the previous row's (a negative time step); times must increase from row to row.`,
            parser,
          );
      }
      if (series.length === MAX_LOAD_LOG_SAMPLES) {
        return fail(`The log has more than ${count(MAX_LOAD_LOG_SAMPLES)} samples; thin it out or upload a shorter stretch.`, parser);
      }
      series.push(t, i);
    },
  });

  if (failure !== null) return { ok: false, message: failure };
  if (series.length === 0)
    return { ok: false, message: 'The file has no numbers; a load log needs rows of time and current, e.g. "0.0,0.12".' };
  if (series.length === 1) return { ok: false, message: 'The log has only one sample; at least two are needed to span some time.' };
  return { ok: true, series };
}

/**
 * The smallest and largest sample of each of PLOT_POINTS / 2 equal runs of
 * samples, in time order: short peaks survive the thinning, which matters more
 * for sizing a supply than a smooth curve.
 */
function plotPoints(s: Series, t0: number): Array<[number, number]> {
  const point = (k: number): [number, number] => [s.t[k]! - t0, s.i[k]!];
  if (s.length <= PLOT_POINTS) return Array.from({ length: s.length }, (_, k) => point(k));
  const buckets = PLOT_POINTS / 2;
  const points: Array<[number, number]> = [];
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor((b * s.length) / buckets);
    const end = Math.floor(((b + 1) * s.length) / buckets);
    let lo = start;
    let hi = start;
    for (let k = start + 1; k < end; k++) {
      if (s.i[k]! < s.i[lo]!) lo = k;
      if (s.i[k]! > s.i[hi]!) hi = k;
    }
    if (lo === hi) points.push(point(lo));
    else for (const k of lo < hi ? [lo, hi] : [hi, lo]) points.push(point(k));
  }
  return points;
}

export function reduceLoadLog(text: string): LoadLogResult {
  const read = readSeries(text);
  if (!read.ok) return read;
  const s = read.series;
  const n = s.length;
  let area = 0;
  let areaOfSquares = 0;
  let min = s.i[0]!;
  let max = s.i[0]!;
  for (let k = 1; k < n; k++) {
    const dt = s.t[k]! - s.t[k - 1]!;
    const a = s.i[k - 1]!;
    const b = s.i[k]!;
    area += ((a + b) / 2) * dt;
    areaOfSquares += ((a * a + b * b) / 2) * dt;
    if (b < min) min = b;
    if (b > max) max = b;
  }
  const durationS = s.t[n - 1]! - s.t[0]!;
  return {
    ok: true,
    summary: {
      samples: n,
      durationS,
      iMinA: min,
      iTypA: area / durationS,
      iRmsA: Math.sqrt(areaOfSquares / durationS),
      iMaxA: max,
      points: plotPoints(s, s.t[0]!),
    },
  };
}
