import { ApiError, invalidParam, missingParam } from './api-error.ts';

/**
 * A request parameter as the API's form encoding carries it: a string, or a hash of nested
 * parameters (`a[b][0][c]=…`). Lists arrive as hashes with index keys and are read with `listParam`.
 */
export type Param = string | ParamHash;
export interface ParamHash {
  [key: string]: Param;
}

function emptyHash(): ParamHash {
  // No prototype, so keys such as `__proto__` or `constructor` are plain data.
  return Object.create(null) as ParamHash;
}

function splitKey(key: string): string[] {
  const open = key.indexOf('[');
  if (open === -1) return [key];
  const segments = [key.slice(0, open)];
  const rest = key.slice(open);
  const pattern = /\[([^[\]]*)\]/gy;
  let consumed = 0;
  for (let match = pattern.exec(rest); match; match = pattern.exec(rest)) {
    segments.push(match[1] ?? '');
    consumed = pattern.lastIndex;
  }
  if (consumed !== rest.length || segments[0] === '') {
    throw new ApiError(400, `Invalid parameter name: ${key}`, { param: key, code: 'parameter_invalid' });
  }
  return segments;
}

/** Builds the nested parameters from a form body or a query string. */
export function parseParams(search: URLSearchParams): ParamHash {
  const root = emptyHash();
  for (const [key, value] of search) {
    const segments = splitKey(key);
    let node = root;
    segments.forEach((rawSegment, depth) => {
      // `expand[]=x` appends, the way the SDK's indexed form `expand[0]=x` does explicitly.
      const segment = rawSegment === '' ? String(Object.keys(node).length) : rawSegment;
      const isLast = depth === segments.length - 1;
      const existing = node[segment];
      if (isLast) {
        if (typeof existing === 'object') {
          throw invalidParam(key, `Parameter ${key} is given both as a value and as a hash.`);
        }
        node[segment] = value;
        return;
      }
      if (typeof existing === 'string') {
        throw invalidParam(key, `Parameter ${key} is given both as a value and as a hash.`);
      }
      const child = existing ?? emptyHash();
      node[segment] = child;
      node = child;
    });
  }
  return root;
}

/** Rejects parameters the stand-in does not know, as the real API does, naming the first one. */
export function rejectUnknown(hash: ParamHash, allowed: readonly string[], prefix?: string): void {
  for (const key of Object.keys(hash)) {
    if (!allowed.includes(key)) {
      const param = prefix ? `${prefix}[${key}]` : key;
      throw new ApiError(400, `Received unknown parameter: ${param}`, { param, code: 'parameter_unknown' });
    }
  }
}

export function optionalString(value: Param | undefined, param: string): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw invalidParam(param, `Invalid string: ${param} must be a single value, not a hash.`);
  return value;
}

export function requiredString(value: Param | undefined, param: string): string {
  const text = optionalString(value, param);
  if (text === undefined || text === '') throw missingParam(param);
  return text;
}

export function optionalHash(value: Param | undefined, param: string): ParamHash | undefined {
  if (value === undefined) return undefined;
  if (typeof value === 'string') {
    // An empty string is how the form encoding sends an empty hash.
    if (value === '') return emptyHash();
    throw invalidParam(param, `Invalid hash: ${param} must be a hash of parameters, not '${value}'.`);
  }
  return value;
}

export function optionalInteger(value: Param | undefined, param: string, bounds: { min: number; max: number }): number | undefined {
  const text = optionalString(value, param);
  if (text === undefined) return undefined;
  if (!/^-?\d+$/.test(text)) throw invalidParam(param, `Invalid integer: ${text}`, 'parameter_invalid_integer');
  const number = Number(text);
  if (number < bounds.min) {
    throw invalidParam(
      param,
      `This value must be greater than or equal to ${bounds.min} (it currently is '${text}').`,
      'parameter_invalid_integer',
    );
  }
  if (number > bounds.max) {
    throw invalidParam(
      param,
      `This value must be less than or equal to ${bounds.max} (it currently is '${text}').`,
      'parameter_invalid_integer',
    );
  }
  return number;
}

/** Reads a list sent as `name[0]=…&name[1]=…`, in index order. */
export function optionalList(value: Param | undefined, param: string): Param[] | undefined {
  if (value === undefined) return undefined;
  if (value === '') return [];
  if (typeof value === 'string') throw invalidParam(param, `Invalid array: ${param} must be a list, e.g. ${param}[0]=…`);
  const keys = Object.keys(value);
  if (!keys.every((key) => /^\d+$/.test(key))) {
    throw invalidParam(param, `Invalid array: ${param} must be indexed with numbers, e.g. ${param}[0]=…`);
  }
  return keys
    .map(Number)
    .sort((a, b) => a - b)
    .map((index) => value[String(index)] as Param);
}

/** Metadata is a flat hash of short strings, as the API limits it. */
export function optionalMetadata(value: Param | undefined, param: string): Record<string, string> | undefined {
  const hash = optionalHash(value, param);
  if (hash === undefined) return undefined;
  const keys = Object.keys(hash);
  if (keys.length > 50) throw invalidParam(param, `${param} can hold at most 50 keys (it has ${keys.length}).`);
  const metadata: Record<string, string> = {};
  for (const key of keys) {
    const entryParam = `${param}[${key}]`;
    if (key.length > 40) throw invalidParam(entryParam, `Metadata keys can be at most 40 characters long ('${key}' has ${key.length}).`);
    const entry = optionalString(hash[key], entryParam) ?? '';
    if (entry.length > 500)
      throw invalidParam(entryParam, `Metadata values can be at most 500 characters long (${entryParam} has ${entry.length}).`);
    // An empty value unsets a key in the API, so it is simply not stored.
    if (entry !== '') metadata[key] = entry;
  }
  return metadata;
}

/** The `expand[]` list, limited to the properties the caller may expand on this object. */
export function expansions(params: ParamHash, expandable: readonly string[]): Set<string> {
  const list = optionalList(params['expand'], 'expand') ?? [];
  const wanted = new Set<string>();
  list.forEach((entry, index) => {
    const path = requiredString(entry, `expand[${index}]`);
    if (!expandable.includes(path)) {
      throw invalidParam(`expand[${index}]`, `This property cannot be expanded (${path}).`);
    }
    wanted.add(path);
  });
  return wanted;
}
