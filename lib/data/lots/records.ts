import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import { ConflictError, DomainError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { labFileRefusal, sniffLabFileType } from '@/lib/domain/file-type';
import { nextStage } from '@/lib/domain/lot-stage';
import { waterFromRefractiveIndex, waterFromScaleReading } from '@/lib/domain/moisture';
import { recordAudit } from '@/lib/data/audit';
import { assertOpen, lockLot } from './access';
import { checkLabFile } from './checks';
import type { Lot } from '@/models/lot';

/** lots.net_grams = Σ (gross − tare) of the lot's non-voided containers, in the caller's transaction. */
async function refreshNet(lot: Lot, t: Transaction): Promise<number> {
  const [row] = await getDb().sequelize.query<{ net: number }>(
    `SELECT COALESCE(SUM(gross_grams - tare_grams), 0)::int AS net FROM lot_containers WHERE lot_id = :lotId AND voided_at IS NULL`,
    { type: QueryTypes.SELECT, replacements: { lotId: lot.id }, transaction: t },
  );
  const net = Number(row.net);
  if (net < lot.usedGrams)
    throw new ConflictError(
      `Lot ${lot.code} has already given ${lot.usedGrams} g to jars or blends; its net weight cannot drop below that.`,
    );
  await lot.update({ netGrams: net }, { transaction: t });
  return net;
}

export type ContainerWeights = {
  containerTypeId?: number | null;
  label: string;
  grossGrams: number;
  tareGrams: number;
};

export async function addContainer(actor: SessionUser, lotId: number, c: ContainerWeights): Promise<number> {
  const { sequelize, models } = getDb();
  if (!(c.grossGrams > c.tareGrams) || c.tareGrams < 0)
    throw new InvalidError('Gross weight must be more than the tare.');
  return sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    if (lot.isBlend) throw new ConflictError('A blend’s weight comes from its parent lots.');
    assertOpen(lot, 'adding a container');
    if (c.containerTypeId && !(await models.ContainerType.findByPk(c.containerTypeId, { transaction: t })))
      throw new NotFoundError('No container type with that id.');
    const row = await models.LotContainer.create(
      {
        lotId,
        containerTypeId: c.containerTypeId ?? null,
        label: c.label,
        grossGrams: c.grossGrams,
        tareGrams: c.tareGrams,
        recordedBy: actor.id,
      },
      { transaction: t },
    );
    const before = lot.netGrams;
    const net = await refreshNet(lot, t);
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.container.add',
        entityType: 'lot',
        entityId: lot.id,
        before: { netGrams: before },
        after: { containerId: row.id, label: c.label, grossGrams: c.grossGrams, tareGrams: c.tareGrams, netGrams: net },
      },
      t,
    );
    return row.id;
  });
}

export type ReadingValues =
  | { method: 'ri'; refractiveIndex: number; temperatureC: number; takenOn: string }
  | { method: 'scale'; scaleWaterPct: number; temperatureC?: number; takenOn: string };

/** % water of a reading, corrected to 20 °C (lib/domain/moisture.ts); a value that is no honey reading is a 422. */
export function readingWater(r: ReadingValues): number {
  try {
    return r.method === 'ri'
      ? waterFromRefractiveIndex(r.refractiveIndex, r.temperatureC)
      : waterFromScaleReading(r.scaleWaterPct, r.temperatureC);
  } catch (err) {
    if (err instanceof RangeError) throw new InvalidError(err.message);
    throw err;
  }
}

export async function addReading(
  actor: SessionUser,
  lotId: number,
  r: ReadingValues,
): Promise<{ id: number; waterPct: number }> {
  const { sequelize, models } = getDb();
  const water = Math.round(readingWater(r) * 100) / 100;
  return sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    assertOpen(lot, 'adding a moisture reading');
    const row = await models.MoistureReading.create(
      {
        lotId,
        method: r.method,
        refractiveIndex: r.method === 'ri' ? r.refractiveIndex : null,
        scaleWaterPct: r.method === 'scale' ? r.scaleWaterPct : null,
        temperatureC: r.temperatureC ?? null,
        waterPct: water,
        takenOn: r.takenOn,
        recordedBy: actor.id,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.reading.add',
        entityType: 'lot',
        entityId: lot.id,
        after: { readingId: row.id, ...r, waterPct: water },
      },
      t,
    );
    return { id: row.id, waterPct: water };
  });
}

export type LabUpload = {
  filename: string;
  bytes: Uint8Array;
  hmfMgKg?: number | null;
  diastaseSchade?: number | null;
  insolubleG100g?: number | null;
  fructoseGlucoseG100g?: number | null;
  sucroseG100g?: number | null;
  conductivityMsCm?: number | null;
  freeAcidMeqKg?: number | null;
};

/**
 * Stores a lab report: type from its first bytes (never its name), at most 10 MB, with its
 * SHA-256. Failing results on a released lot hold it at once, with the failures as reasons.
 */
export async function addLabFile(
  actor: SessionUser,
  lotId: number,
  f: LabUpload,
): Promise<{ id: number; sha256: string; held: boolean }> {
  const refusal = labFileRefusal(f.bytes);
  if (refusal) throw new DomainError(refusal.includes('10 MB') ? 'too-large' : 'unsupported-type', refusal);
  const contentType = sniffLabFileType(f.bytes)!;
  const sha256 = createHash('sha256').update(f.bytes).digest('hex');
  const results = {
    hmfMgKg: f.hmfMgKg ?? null,
    diastaseSchade: f.diastaseSchade ?? null,
    insolubleG100g: f.insolubleG100g ?? null,
    fructoseGlucoseG100g: f.fructoseGlucoseG100g ?? null,
    sucroseG100g: f.sucroseG100g ?? null,
    conductivityMsCm: f.conductivityMsCm ?? null,
    freeAcidMeqKg: f.freeAcidMeqKg ?? null,
  };
  const filename = f.filename.replace(/[\\/\u0000-\u001f"]/g, '_').slice(0, 200) || 'lab-report';
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    if (lot.stage === 'packed_out') throw new ConflictError(`Lot ${lot.code} is packed out.`);
    // Council Directive 2001/110/EC Annex II for this lot's own category
    const composition = checkLabFile(lot, results);
    const check = { pass: composition.pass, failures: composition.failureTexts };
    const row = await models.LabFile.create(
      {
        lotId,
        filename,
        contentType,
        sizeBytes: f.bytes.length,
        sha256,
        data: Buffer.from(f.bytes),
        ...results,
        uploadedBy: actor.id,
      },
      { transaction: t },
    );
    await recordAudit(
      {
        actorUserId: actor.id,
        action: 'lot.labfile.add',
        entityType: 'lot',
        entityId: lot.id,
        after: {
          labFileId: row.id,
          filename,
          contentType,
          sizeBytes: f.bytes.length,
          sha256,
          ...results,
          pass: check.pass,
        },
      },
      t,
    );
    let held = false;
    if (!check.pass && lot.stage === 'released') {
      const reason = check.failures.join('; ');
      const moved = nextStage(lot.stage, 'held', {
        role: actor.role,
        hasWeights: true,
        moistureOk: null,
        labOk: false,
        unresolvedFlaggedSupers: 0,
        remainingGrams: 0,
        reason,
      });
      if (moved.ok) {
        await lot.update({ stage: 'held', holdReasons: check.failures }, { transaction: t });
        await recordAudit(
          {
            actorUserId: actor.id,
            action: 'lot.stage.held',
            entityType: 'lot',
            entityId: lot.id,
            before: { stage: 'released' },
            after: { stage: 'held', holdReasons: check.failures },
            reason,
          },
          t,
        );
        held = true;
      }
    }
    return { id: row.id, sha256, held };
  });
}

export type VoidKind = 'container' | 'reading' | 'labFile';

/** Corrects a record by voiding it (who, when, why); nothing is edited or deleted. */
export async function voidRecord(
  actor: SessionUser,
  lotId: number,
  kind: VoidKind,
  recordId: number,
  reason: string,
): Promise<void> {
  const { sequelize, models } = getDb();
  await sequelize.transaction(async (t) => {
    const lot = await lockLot(lotId, t);
    const model =
      kind === 'container' ? models.LotContainer : kind === 'reading' ? models.MoistureReading : models.LabFile;
    const row = await (model as typeof models.LotContainer).findOne({
      where: { id: recordId, lotId },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!row) throw new NotFoundError('No such record on this lot.');
    if (row.voidedAt) throw new ConflictError('That record is already voided.');
    await row.update({ voidedAt: new Date(), voidedBy: actor.id, voidReason: reason.trim() }, { transaction: t });
    const after: Record<string, unknown> = { kind, recordId };
    if (kind === 'container') {
      after.netGramsBefore = lot.netGrams;
      after.netGrams = await refreshNet(lot, t);
    }
    await recordAudit(
      {
        actorUserId: actor.id,
        action: `lot.${kind === 'labFile' ? 'labfile' : kind}.void`,
        entityType: 'lot',
        entityId: lot.id,
        before: { recordId, voidedAt: null },
        after,
        reason: reason.trim(),
      },
      t,
    );
  });
}

/** A stored lab report for download, or null (the caller checks the reader may see the lot). */
export async function getLabFileData(
  fileId: number,
): Promise<{ lotId: number; filename: string; contentType: string; data: Buffer; sha256: string } | null> {
  const row = await getDb().models.LabFile.findByPk(fileId);
  if (!row) return null;
  return { lotId: row.lotId, filename: row.filename, contentType: row.contentType, data: row.data, sha256: row.sha256 };
}
