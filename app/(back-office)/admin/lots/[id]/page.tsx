import Link from 'next/link';
import { todayIn } from '@/lib/domain/local-date';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getLotDetail } from '@/lib/data/lots/detail';
import { listPullableSupers, listYardsBrief } from '@/lib/data/lots/supers';
import { listContainerTypes } from '@/lib/data/lots/container-types';
import { getSettings } from '@/lib/data/settings/settings';
import { formatWeight } from '@/lib/domain/units';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { Caution } from '@/components/ui/caution';
import { StageChip } from '@/components/lots/stage-chip';
import { StageControls } from '@/components/lots/stage-controls';
import { SuperScanner } from '@/components/lots/super-scanner';
import { SuperPicker } from '@/components/lots/super-picker';
import { ContainerForm } from '@/components/lots/container-form';
import { ReadingForm } from '@/components/lots/reading-form';
import { LabUploadForm } from '@/components/lots/lab-upload-form';
import { VoidButton } from '@/components/lots/void-button';
import { EmptyWeightForm, WaxForm } from '@/components/lots/weight-field-form';
import { LotHistory } from '@/components/lots/lot-history';
import { RemoveSuperButton } from '@/components/lots/remove-super-button';
import { LotDetailsForm } from '@/components/lots/lot-details-form';
import { CompositionVerdict } from '@/components/lots/composition-verdict';
import { LAB_RESULT_FIELDS, type LotDetailsInput } from '@/lib/schemas/lots';
import { floralSourceSuggestions } from '@/lib/data/lots/lots';
import { LotTrace } from '@/components/lots/lot-trace';
import {
  addContainerAction,
  addReadingAction,
  changeStageAction,
  emptyWeightAction,
  pickSupersAction,
  removeSuperAction,
  scanSuperAction,
  updateLotAction,
  voidRecordAction,
  waxAction,
} from '../actions';
import { TableHead, EmptyRow, num } from '@/components/ui/table-parts';
import { SelectField, namedChoices } from '@/components/ui/select-field';

export const metadata = { title: 'Lot' };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (typeof v === 'string' ? v : undefined);
const FERMENT_TONE = { low: 'ok', 'yeast-dependent': 'info', 'high-yeast-dependent': 'warn', likely: 'bad' } as const;

/** The lots a blend was made from, or the blends a lot went into, with the grams of each. */
function BlendLinks({
  id,
  title,
  links,
  weight,
}: {
  id: string;
  title: string;
  links: { lotId: number; code: string; grams: number }[];
  weight: (grams: number) => string;
}) {
  return (
    <section className="space-y-2 card" aria-labelledby={id}>
      <h2 id={id}>{title}</h2>
      <ul className="text-sm">
        {links.map((l) => (
          <li key={l.lotId}>
            <Link href={`/admin/lots/${l.lotId}`} className="font-mono">
              {l.code}
            </Link>
            : {weight(l.grams)}
          </li>
        ))}
      </ul>
    </section>
  );
}

export default async function LotPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Search>;
}) {
  const { id: rawId } = await params;
  const user = await requirePermission('lots.read', `/admin/lots/${rawId}`);
  const id = Number(rawId);
  if (!Number.isInteger(id) || id < 1) notFound();
  const lot = await getLotDetail(user, id);
  if (!lot) notFound();
  const sp = await searchParams;
  const settings = await getSettings();
  const w = (g: number) => formatWeight(g, settings.weightSystem);
  const unit = settings.weightSystem === 'us' ? 'lb' : 'kg';
  const writer = can(user.role, 'lots.write');
  const isOwner = user.role === 'owner';
  const open = ['gathering', 'extracted', 'held'].includes(lot.stage);
  const takesSupers = writer && !lot.isBlend && (lot.stage === 'gathering' || lot.stage === 'extracted');
  const yardId = Number(one(sp.yard)) || undefined;
  const [pullable, yards, types] = takesSupers
    ? await Promise.all([listPullableSupers({ yardId, q: one(sp.q) }), listYardsBrief(), listContainerTypes()])
    : [[], [], writer ? await listContainerTypes() : []];
  const today = todayIn(settings.timeZone);
  const live = <T extends { voidedAt: Date | null }>(rows: T[]) => rows.filter((r) => !r.voidedAt);

  return (
    <>
      <PageHeader
        title={`Lot ${lot.code}`}
        lead={
          <>
            {lot.floralSource || 'No floral source yet'}
            {lot.heather ? ' · heather' : ''}
            {lot.isBlend ? ' · blend' : ''}
            {lot.extractedOn ? ` · extracted ${lot.extractedOn}` : ''}
          </>
        }
        actions={
          <Link href="/admin/lots" className="btn-quiet">
            All lots
          </Link>
        }
      />
      <div className="grid gap-6">
        <section className="space-y-3 card" aria-labelledby="stage-h">
          <div className="flex flex-wrap items-center gap-3">
            <h2 id="stage-h">Stage</h2>
            <StageChip stage={lot.stage} />
          </div>
          {lot.stage === 'held' && lot.holdReasons.length ? (
            <ul aria-label="Why the lot is held" className="list-disc pl-5 text-sm">
              {lot.holdReasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          ) : null}
          {lot.stage === 'extracted' && lot.failures.length ? (
            <p className="text-sm">Releasing now would hold the lot: {lot.failures.join('; ')}.</p>
          ) : null}
          <dl className="grid grid-cols-2 gap-2 text-sm sm:grid-cols-4">
            <div>
              <dt className="hint">Net weight</dt>
              <dd className="text-lg font-semibold">{w(lot.netGrams)}</dd>
            </div>
            <div>
              <dt className="hint">Used (jars, blends)</dt>
              <dd>{w(lot.usedGrams)}</dd>
            </div>
            <div>
              <dt className="hint">Left</dt>
              <dd>{w(lot.remainingGrams)}</dd>
            </div>
            <div>
              <dt className="hint">Highest water</dt>
              <dd>{lot.water ? `${lot.water.highest.toFixed(1)} %` : '—'}</dd>
            </div>
            <div>
              <dt className="hint">Extracted</dt>
              <dd>{lot.extractedOn ?? '—'}</dd>
            </div>
            <div>
              <dt className="hint">Best before</dt>
              <dd>{lot.bestBeforeOn ?? '—'}</dd>
            </div>
          </dl>
          {writer ? (
            <StageControls
              lotId={lot.id}
              stage={lot.stage}
              isOwner={isOwner}
              today={today}
              extractedOn={lot.extractedOn}
              bestBeforeMonths={settings.bestBeforeMonths}
              onChange={changeStageAction}
            />
          ) : null}
        </section>

        {!lot.isBlend ? (
          <section className="space-y-4 card" aria-labelledby="supers-h">
            <h2 id="supers-h">Supers ({lot.supers.length})</h2>
            {takesSupers ? <SuperScanner lotId={lot.id} isOwner={isOwner} onScan={scanSuperAction} /> : null}
            <div className="overflow-x-auto">
              <table className="data-table">
                <caption className="sr-only">Supers in this lot</caption>
                <TableHead
                  columns={['Tag', 'Colony', 'Yard', 'Pulled', num('Full'), num('Empty'), num('Honey'), 'Status']}
                />
                <tbody>
                  {lot.supers.map((s) => (
                    <tr key={s.id}>
                      <td className="font-mono">{s.tagCode ?? `#${s.id}`}</td>
                      <td>{s.colonyCode}</td>
                      <td>{s.yardName}</td>
                      <td>{s.pulledOn}</td>
                      <td className="num">{s.fullGrams !== null ? w(s.fullGrams) : '—'}</td>
                      <td className="num">
                        {s.emptyGrams !== null ? w(s.emptyGrams) : null}
                        {writer && open ? (
                          <EmptyWeightForm
                            lotId={lot.id}
                            superPullId={s.id}
                            tag={s.tagCode ?? String(s.id)}
                            unit={unit}
                            onSave={emptyWeightAction}
                          />
                        ) : s.emptyGrams === null ? (
                          '—'
                        ) : null}
                      </td>
                      <td className="num">
                        {w(s.honeyGrams)} <span className="hint">{s.measured ? 'measured' : 'estimated'}</span>
                      </td>
                      <td>
                        {s.flagged ? (
                          s.overrideReason ? (
                            <Chip tone="warn" title={s.overrideReason}>
                              overridden
                            </Chip>
                          ) : (
                            <Chip tone="bad" title={s.flagReasons.join('; ')}>
                              flagged
                            </Chip>
                          )
                        ) : (
                          <Chip tone="ok">clear</Chip>
                        )}
                        {writer && lot.stage === 'gathering' ? (
                          <RemoveSuperButton
                            lotId={lot.id}
                            superPullId={s.id}
                            tag={s.tagCode ?? String(s.id)}
                            onRemove={removeSuperAction}
                          />
                        ) : null}
                      </td>
                    </tr>
                  ))}
                  {lot.supers.length === 0 ? <EmptyRow columns={8}>No supers yet.</EmptyRow> : null}
                </tbody>
              </table>
            </div>
            {takesSupers ? (
              <details className="space-y-3">
                <summary className="btn-quiet cursor-pointer">Pick from pulled supers ({pullable.length})</summary>
                <form method="get" className="grid gap-2 sm:grid-cols-3 sm:items-end" aria-label="Filter pulled supers">
                  <SelectField
                    id="yard"
                    name="yard"
                    label="Yard"
                    className="input"
                    defaultValue={yardId ? String(yardId) : ''}
                    options={[{ value: '', label: 'All yards' }, ...namedChoices(yards)]}
                  />
                  <label className="field" htmlFor="q">
                    <span>Tag or colony</span>
                    <input id="q" name="q" className="input" defaultValue={one(sp.q) ?? ''} />
                  </label>
                  <button type="submit" className="btn-secondary">
                    Filter
                  </button>
                </form>
                <SuperPicker
                  lotId={lot.id}
                  onPick={pickSupersAction}
                  supers={pullable.map((p) => ({ ...p, full: p.fullGrams !== null ? w(p.fullGrams) : '—' }))}
                />
              </details>
            ) : null}
          </section>
        ) : (
          <BlendLinks id="parents-h" title="Made from" links={lot.parents} weight={w} />
        )}

        {!lot.isBlend ? (
          <section className="space-y-4 card" aria-labelledby="containers-h">
            <h2 id="containers-h">Containers</h2>
            {writer && open ? (
              <ContainerForm lotId={lot.id} types={types} unit={unit} onSave={addContainerAction} />
            ) : null}
            <div className="overflow-x-auto">
              <table className="data-table">
                <caption className="sr-only">Containers of this lot</caption>
                <TableHead columns={['Container', num('Gross'), num('Tare'), num('Net'), 'Status']} />
                <tbody>
                  {lot.containers.map((c) => (
                    <tr key={c.id} className={c.voidedAt ? 'line-through decoration-ink-faint' : undefined}>
                      <td>{[c.typeName, c.label].filter(Boolean).join(' · ') || `#${c.id}`}</td>
                      <td className="num">{w(c.grossGrams)}</td>
                      <td className="num">{w(c.tareGrams)}</td>
                      <td className="num">{w(c.netGrams)}</td>
                      <td className="no-underline">
                        {c.voidedAt ? (
                          <Chip tone="neutral" title={c.voidReason ?? ''}>
                            voided
                          </Chip>
                        ) : writer ? (
                          <VoidButton
                            lotId={lot.id}
                            kind="container"
                            recordId={c.id}
                            what={`container ${c.label || c.id}`}
                            onVoid={voidRecordAction}
                          />
                        ) : (
                          <Chip tone="ok">counted</Chip>
                        )}
                      </td>
                    </tr>
                  ))}
                  {lot.containers.length === 0 ? <EmptyRow columns={5}>No containers weighed yet.</EmptyRow> : null}
                </tbody>
                <tfoot>
                  <tr>
                    <th scope="row" colSpan={3}>
                      Lot net ({live(lot.containers).length} containers)
                    </th>
                    <td className="num font-semibold">{w(lot.netGrams)}</td>
                    <td />
                  </tr>
                </tfoot>
              </table>
            </div>
            <Caution>Full containers of honey are heavy: lift with help or a hoist, and keep floors dry.</Caution>
          </section>
        ) : null}

        {!lot.isBlend ? (
          <section className="space-y-3 card" aria-labelledby="yield-h">
            <h2 id="yield-h">Yield and cappings wax</h2>
            <dl className="grid grid-cols-2 gap-2 text-sm sm:grid-cols-4">
              <div>
                <dt className="hint">Lot net</dt>
                <dd>{w(lot.netGrams)}</dd>
              </div>
              <div>
                <dt className="hint">Honey in the supers</dt>
                <dd>
                  {w(lot.yield.expectedGrams)}{' '}
                  <span className="hint">
                    ({lot.yield.measuredCount} measured, {lot.yield.estimatedCount} estimated)
                  </span>
                </dd>
              </div>
              <div>
                <dt className="hint">Extraction yield</dt>
                <dd className="text-lg font-semibold">
                  {lot.yield.pct === null ? '—' : `${lot.yield.pct.toFixed(0)} %`}
                </dd>
              </div>
              <div>
                <dt className="hint">Cappings wax</dt>
                <dd>{lot.cappingsWaxGrams === null ? '—' : w(lot.cappingsWaxGrams)}</dd>
              </div>
            </dl>
            {lot.yield.warning ? (
              <p role="status" className="text-sm">
                <Chip tone="warn">check</Chip> {lot.yield.warning}
              </p>
            ) : null}
            {writer && open ? <WaxForm lotId={lot.id} unit={unit} onSave={waxAction} /> : null}
            <p className="hint">
              Estimates use the owner’s honey per super by depth; a super’s empty weight makes it measured (full −
              empty).
            </p>
          </section>
        ) : null}

        <section className="space-y-4 card" aria-labelledby="moisture-h">
          <h2 id="moisture-h">Moisture</h2>
          {lot.water ? (
            <div className="flex flex-wrap items-center gap-2 text-sm" aria-label="Moisture summary">
              <span>
                Highest <strong>{lot.water.highest.toFixed(1)} %</strong>
              </span>
              ·
              <span>
                mean <strong>{lot.water.mean.toFixed(1)} %</strong>
              </span>
              {lot.water.fromParents ? (
                <span className="hint">(weight-weighted mean of the parent lots)</span>
              ) : (
                <span className="hint">
                  ({lot.water.count} reading{lot.water.count === 1 ? '' : 's'})
                </span>
              )}
              {lot.grade ? (
                <Chip tone={lot.grade.withinLimit ? 'ok' : 'bad'}>
                  {lot.grade.withinLimit ? 'within limit' : 'over limit'}
                </Chip>
              ) : null}
              {lot.grade?.usGradeAB ? <Chip tone="info">water within US Grade A limit</Chip> : null}
              {lot.fermentation ? (
                <Chip tone={FERMENT_TONE[lot.fermentation.band]}>
                  fermentation: {lot.fermentation.band.replace(/-/g, ' ')}
                </Chip>
              ) : null}
            </div>
          ) : (
            <p className="hint">No moisture reading yet.</p>
          )}
          {lot.grade ? (
            <p className="text-sm">
              {lot.grade.label}. {lot.fermentation?.label}.
            </p>
          ) : null}
          {writer && open ? <ReadingForm lotId={lot.id} today={today} onSave={addReadingAction} /> : null}
          {lot.readings.length ? (
            <div className="overflow-x-auto">
              <table className="data-table">
                <caption className="sr-only">Moisture readings</caption>
                <TableHead columns={['Taken', 'Read as', num('Temperature'), num('Water at 20 °C'), 'Status']} />
                <tbody>
                  {lot.readings.map((r) => (
                    <tr key={r.id} className={r.voidedAt ? 'line-through decoration-ink-faint' : undefined}>
                      <td>{r.takenOn}</td>
                      <td>
                        {r.method === 'ri'
                          ? `nD ${Number(r.refractiveIndex).toFixed(4)}`
                          : `${r.scaleWaterPct} % on the scale`}
                      </td>
                      <td className="num">{r.temperatureC === null ? 'compensated' : `${r.temperatureC} °C`}</td>
                      <td className="num">{r.waterPct.toFixed(1)} %</td>
                      <td>
                        {r.voidedAt ? (
                          <Chip title={r.voidReason ?? ''}>voided</Chip>
                        ) : writer ? (
                          <VoidButton
                            lotId={lot.id}
                            kind="reading"
                            recordId={r.id}
                            what={`reading of ${r.takenOn}`}
                            onVoid={voidRecordAction}
                          />
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
          <Caution>
            Limits start at published honey standards (EU 2001/110/EC, USDA grades); follow your local food law.
            Combtrace records and warns; it does not certify.
          </Caution>
        </section>

        {writer && open ? (
          <section className="space-y-3 card" aria-labelledby="details-h">
            <h2 id="details-h">Details</h2>
            <LotDetailsForm
              onSave={updateLotAction}
              suggestions={await floralSourceSuggestions()}
              defaults={{
                lotId: lot.id,
                floralSource: lot.floralSource,
                heather: lot.heather,
                honeyOrigin: lot.category.origin,
                annexSource: (lot.annexSource ?? '') as LotDetailsInput['annexSource'],
                bakers: lot.category.bakers ?? false,
                pressed: lot.category.pressed ?? false,
                tropical: lot.category.tropical ?? false,
                lowEnzyme: lot.category.lowEnzyme ?? false,
                extractedOn: lot.extractedOn ?? '',
                notes: lot.notes,
              }}
            />
          </section>
        ) : lot.notes ? (
          <section className="card" aria-label="Notes">
            <h2>Notes</h2>
            <p className="text-sm whitespace-pre-line">{lot.notes}</p>
          </section>
        ) : null}

        <section className="space-y-4 card" aria-labelledby="lab-h">
          <h2 id="lab-h">Lab reports</h2>
          {writer && lot.stage !== 'packed_out' ? <LabUploadForm lotId={lot.id} /> : null}
          {lot.labFiles.length ? (
            <div className="overflow-x-auto">
              <table className="data-table">
                <caption className="sr-only">Lab reports</caption>
                <TableHead
                  columns={[
                    'File',
                    num('HMF'),
                    num('Diastase'),
                    num('Insoluble'),
                    'Result',
                    { label: 'Actions', hidden: true },
                  ]}
                />
                <tbody>
                  {lot.labFiles.map((f) => (
                    <tr key={f.id} className={f.voidedAt ? 'line-through decoration-ink-faint' : undefined}>
                      <td>
                        <a href={`/api/lab-files/${f.id}`} download>
                          {f.filename}
                        </a>{' '}
                        <span className="hint">
                          {(f.sizeBytes / 1024).toFixed(0)} KB · sha256 {f.sha256.slice(0, 12)}…
                        </span>
                      </td>
                      <td className="num">{f.hmfMgKg ?? '—'}</td>
                      <td className="num">{f.diastaseSchade ?? '—'}</td>
                      <td className="num">{f.insolubleG100g ?? '—'}</td>
                      <td>
                        {f.voidedAt ? (
                          <Chip title={f.voidReason ?? ''}>voided</Chip>
                        ) : f.failures.length ? (
                          <Chip tone="bad" title={f.failures.join('; ')}>
                            fails limits
                          </Chip>
                        ) : LAB_RESULT_FIELDS.every((k) => f[k] === null) ? (
                          <Chip>file only</Chip>
                        ) : (
                          <Chip tone="ok">within limits</Chip>
                        )}
                      </td>
                      <td>
                        {!f.voidedAt && writer ? (
                          <VoidButton
                            lotId={lot.id}
                            kind="labFile"
                            recordId={f.id}
                            what={f.filename}
                            onVoid={voidRecordAction}
                          />
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : (
            <p className="hint">No lab reports.</p>
          )}
          <CompositionVerdict rows={lot.composition} category={lot.category} />
        </section>

        {lot.children.length ? (
          <BlendLinks id="children-h" title="Blended into" links={lot.children} weight={w} />
        ) : null}

        <section className="space-y-3 card" aria-labelledby="trace-h">
          <h2 id="trace-h">Where it came from</h2>
          <LotTrace rows={lot.trace} />
          <Caution>
            Mite treatments: the product label governs whether honey supers may be on; this trace shows what was
            recorded.
          </Caution>
        </section>

        <section className="space-y-3 card" aria-labelledby="history-h">
          <h2 id="history-h">History</h2>
          <LotHistory rows={lot.history} timeZone={settings.timeZone} />
        </section>
      </div>
    </>
  );
}
