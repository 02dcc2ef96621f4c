import { z } from 'zod';
import { TABLE_KEYS } from '@/lib/reports/season-tables';

const id = z.coerce.number().int().positive().max(2_147_483_647);
const season = z.coerce.number().int().min(2000).max(2100);

type Params = Record<string, string | string[] | undefined> | URLSearchParams;

function first(params: Params, key: string): string | undefined {
  const v = params instanceof URLSearchParams ? (params.get(key) ?? undefined) : params[key];
  return Array.isArray(v) ? v[0] : v;
}

function pick<T>(schema: z.ZodType<T>, value: string | undefined): T | undefined {
  if (value === undefined || value === '') return undefined;
  const parsed = schema.safeParse(value);
  return parsed.success ? parsed.data : undefined;
}

/** Only season, yard and keeper are read from a report URL; anything else, or a bad value, is ignored. */
export function parseReportQuery(params: Params): { season?: number; yardId?: number; keeperId?: number } {
  return {
    season: pick(season, first(params, 'season')),
    yardId: pick(id, first(params, 'yard')),
    keeperId: pick(id, first(params, 'keeper')),
  };
}

export const reportTableKey = z.enum(TABLE_KEYS);
export const sendSeasonInput = z.object({ season });
export const sendKeeperInput = z.object({ season, keeperId: id });
export const recallFormat = z.enum(['csv', 'pdf']);
export const idParam = id;
