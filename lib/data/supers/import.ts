import 'server-only';
import Papa from 'papaparse';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import {
  validatePullRows,
  type PullMapping,
  type PullRowError,
  type ValidPullRow,
} from '@/lib/domain/super-pull-import';
import { ConflictError, DomainError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { recordAudit } from '@/lib/data/audit';
import { canWriteColonies, yardScope } from '@/lib/data/yards/scope';
import { colonyRecords, flagsWith, type ColonyRecords } from './flags';

export const MAX_IMPORT_BYTES = 5 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 5000;

export type ParsedSheet = { headers: string[]; rows: Record<string, string>[] };

/** Parses the CSV text (header row first). Refuses files with no header or too many rows. */
export function parseSheet(text: string): ParsedSheet {
  const result = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: false,
    transformHeader: (h) => h.trim(),
  });
  const headers = (result.meta.fields ?? []).filter((h) => h !== '');
  if (headers.length === 0) throw new InvalidError('The file has no header row. The first line must name the columns.');
  const rows = result.data.filter(
    (r, i) => !(i === result.data.length - 1 && Object.values(r).every((v) => !v?.trim())),
  );
  if (rows.length > MAX_IMPORT_ROWS) throw new DomainError('too-large', `At most ${MAX_IMPORT_ROWS} rows per file.`);
  return { headers, rows: rows.map((r) => Object.fromEntries(headers.map((h) => [h, String(r[h] ?? '')]))) };
}

/** Guesses which column is which from common header words. */
export function guessMapping(headers: string[]): Partial<PullMapping> {
  const find = (re: RegExp) => headers.find((h) => re.test(h.toLowerCase()));
  return {
    colonyCode: find(/colony|hive/),
    pulledOn: find(/date|pulled/),
    depth: find(/depth|box/),
    frameCount: find(/^frames?$|frame.?count/),
    fullWeight: find(/weight|kg|lb/),
    weightUnit: find(/unit/),
    cappedFrames: find(/capped/),
    tagCode: find(/tag/),
  };
}

async function known(user: SessionUser) {
  const { models } = getDb();
  const scope = await yardScope(user);
  // Only the user's own colonies count as known: another keeper's colony is an unknown colony.
  const colonies = await models.Colony.findAll({
    where: scope.all ? {} : { yardId: scope.yardIds },
    attributes: ['id', 'code'],
  });
  // A tag pulled and not yet in a lot is still a full box waiting for the honey house (unless that pull was voided).
  const tags = await models.SuperPull.findAll({
    where: { pulledOn: { [Op.ne]: null }, lotId: null, voidedAt: null, tagCode: { [Op.ne]: null } },
    attributes: ['tagCode'],
  });
  return {
    colonyIds: new Map(colonies.map((c) => [c.code, c.id])),
    colonyCodes: new Set(colonies.map((c) => c.code)),
    existingTagCodes: new Set(tags.map((t) => (t.tagCode as string).toUpperCase())),
  };
}

export type ImportPreview = {
  headers: string[];
  mapping: Partial<PullMapping>;
  valid: ValidPullRow[];
  errors: PullRowError[];
  total: number;
};

export async function previewImport(
  user: SessionUser,
  text: string,
  mapping: PullMapping | null,
  today: string,
): Promise<ImportPreview> {
  const sheet = parseSheet(text);
  const use = mapping ?? guessMapping(sheet.headers);
  const ready = use.colonyCode && use.pulledOn && use.depth;
  if (!ready) return { headers: sheet.headers, mapping: use, valid: [], errors: [], total: sheet.rows.length };
  for (const column of Object.values(use)) {
    if (column && !sheet.headers.includes(column)) throw new InvalidError(`The file has no column "${column}".`);
  }
  const k = await known(user);
  const { valid, errors } = validatePullRows(sheet.rows, use as PullMapping, k, { today });
  return { headers: sheet.headers, mapping: use, valid, errors, total: sheet.rows.length };
}

/**
 * Imports every valid row in one transaction: if any row fails to store, none is stored.
 * Rejected rows are not imported; the caller offers them back as a CSV to fix.
 */
export async function commitImport(
  user: SessionUser,
  text: string,
  mapping: PullMapping,
  today: string,
  expectedValid?: number,
): Promise<{ imported: number; flagged: number; errors: PullRowError[] }> {
  if (!canWriteColonies(user)) throw new NotFoundError('No such colony.');
  const { sequelize, models } = getDb();
  const sheet = parseSheet(text);
  const k = await known(user);
  const { valid, errors } = validatePullRows(sheet.rows, mapping, k, { today });
  if (valid.length === 0) throw new InvalidError('No valid rows to import.');
  if (expectedValid !== undefined && expectedValid !== valid.length)
    throw new ConflictError('The records changed since the preview. Check the preview again.');
  let flagged = 0;
  await sequelize.transaction(async (t) => {
    // Each colony's feedings, treatments and pulls are read once; rows of this sheet join its pulls as they go in.
    const records = new Map<number, ColonyRecords>();
    for (const row of valid) {
      const colonyId = k.colonyIds.get(row.colonyCode) as number;
      let colony = records.get(colonyId);
      if (!colony) records.set(colonyId, (colony = await colonyRecords(colonyId, t)));
      const flags = flagsWith(colony, { pulledOn: row.pulledOn, putOnOn: null });
      if (flags.flagged) flagged++;
      const created = await models.SuperPull.create(
        {
          colonyId,
          pulledOn: row.pulledOn,
          depth: row.depth,
          frameCount: row.frameCount,
          fullGrams: row.fullGrams,
          cappedFrames: row.cappedFrames,
          tagCode: row.tagCode,
          pulledBy: user.id,
          note: `Imported from field sheet, row ${row.row}`,
          ...flags,
        },
        { transaction: t },
      );
      colony.pulledDates.push({ id: created.id, pulledOn: row.pulledOn });
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'superPulls.import',
        entityType: 'superPulls',
        entityId: 'import',
        after: { imported: valid.length, rejected: errors.length },
      },
      t,
    );
  });
  return { imported: valid.length, flagged, errors };
}
