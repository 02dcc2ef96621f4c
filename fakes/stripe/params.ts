// Reading form parameters (SDK src/utils.ts `stringifyRequestData`): the SDK sends `a[b][0][c]=…`, which `qs.parse` turns into
// nested objects and arrays. Every leaf is a string, so numbers are parsed and checked here.
import qs from 'qs';
import { invalid, missingParam } from './errors';

export type Params = qs.ParsedQs;
type Value = Params[string];

/** `arrayLimit` is raised because qs turns indices above 20 into object keys by default. */
export function parseForm(text: string): Params {
  return qs.parse(text, { depth: 10, arrayLimit: 1000, parameterLimit: 5000 });
}

export function str(value: Value, param: string): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw invalid(`Invalid string: ${param} must be a string.`, param);
  return value;
}

export function requiredStr(value: Value, param: string): string {
  const s = str(value, param);
  if (s === undefined || s === '') throw missingParam(param);
  return s;
}

export function int(value: Value, param: string, min = 0): number | undefined {
  const s = str(value, param);
  if (s === undefined) return undefined;
  if (!/^-?\d+$/.test(s) || Number(s) < min) throw invalid(`Invalid integer: ${s}`, param, 'parameter_invalid_integer');
  return Number(s);
}

export function obj(value: Value, param: string): Params | undefined {
  if (value === undefined || value === '') return undefined;
  if (typeof value !== 'object' || Array.isArray(value)) throw invalid(`Invalid object: ${param}`, param);
  return value as Params;
}

/** Accepts a real array or qs's `{ "0": …, "1": … }` fallback form. */
export function list(value: Value, param: string): Value[] {
  if (value === undefined) return [];
  if (Array.isArray(value)) return value;
  if (typeof value === 'object') {
    const keys = Object.keys(value);
    if (keys.every((k) => /^\d+$/.test(k))) return keys.sort((a, b) => Number(a) - Number(b)).map((k) => value[k]);
  }
  throw invalid(`Invalid array: ${param}`, param);
}

/** Stripe metadata is string→string; `metadata=` (empty) clears it. */
export function metadata(value: Value, param: string): Record<string, string> {
  const o = obj(value, param) ?? {};
  const out: Record<string, string> = {};
  for (const [key, v] of Object.entries(o)) out[key] = str(v, `${param}[${key}]`) ?? '';
  return out;
}

/** `expand[0]=line_items` → ['line_items']. */
export function expandList(params: Params): string[] {
  return list(params.expand, 'expand').map((v, i) => str(v, `expand[${i}]`) ?? '');
}

/** Stable text of the parameters, so the same request encoded in another key order still matches (idempotency.ts). */
export function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}
