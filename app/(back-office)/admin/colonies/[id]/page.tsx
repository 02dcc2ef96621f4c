import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getColony } from '@/lib/data/colonies/read';
import { listColonySupers } from '@/lib/data/supers/pulls';
import { colonyTimeline } from '@/lib/data/colonies/timeline';
import { listTreatmentKinds } from '@/lib/data/colonies/records';
import { listYardChoices } from '@/lib/data/yards/yards';
import { getSettings } from '@/lib/data/settings/settings';
import { listFreeTags } from '@/lib/data/supers/tags';
import { formatWeight } from '@/lib/domain/units';
import { localDate, todayIn } from '@/lib/domain/local-date';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { ColonyStatusChip, FlagCell, QueenColour } from '@/components/colonies/chips';
import { TreatmentCaution } from '@/components/colonies/treatment-caution';
import { VoidedNote, VoidPullButton } from '@/components/supers/void-pull-button';
import {
  EndRecordForm,
  FeedingForm,
  MoveForm,
  NoteForm,
  SplitForm,
  StatusForm,
  SuperOnForm,
  TreatmentForm,
} from '@/components/colonies/record-forms';
import {
  addFeedingAction,
  addTreatmentAction,
  colonyNoteAction,
  colonyStatusAction,
  endFeedingAction,
  endTreatmentAction,
  moveColonyAction,
  splitColonyAction,
  superOnAction,
} from '../actions';
import { voidSuperPullAction } from '../../supers/actions';
import { TableHead, num } from '@/components/ui/table-parts';

export const metadata = { title: 'Colony' };

function Section({ title, children, open = false }: { title: string; children: React.ReactNode; open?: boolean }) {
  return (
    <details className="card" open={open}>
      <summary className="min-h-11 cursor-pointer font-heading text-lg font-bold text-forest-800">{title}</summary>
      <div className="mt-3">{children}</div>
    </details>
  );
}

export default async function ColonyPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('colonies.read', `/admin/colonies/${id}`);
  const colony = await getColony(user, Number(id));
  if (!colony) notFound();
  const settings = await getSettings();
  const fmt = (g: number) => formatWeight(g, settings.weightSystem);
  const today = todayIn(settings.timeZone);
  const write = can(user.role, 'colonies.write');
  const [supers, timeline, freeTags] = await Promise.all([
    listColonySupers(colony.id),
    colonyTimeline(colony.id, fmt),
    write ? listFreeTags() : Promise.resolve([]),
  ]);
  const canVoid = can(user.role, 'supers.write');
  const voidedOn = (at: string) => localDate(new Date(at), settings.timeZone);
  const superOnWhat = (s: { putOnOn: string | null; tagCode: string | null }) =>
    `the super on${s.putOnOn ? ` of ${s.putOnOn}` : ''}${s.tagCode ? `, tag ${s.tagCode}` : ''}`;
  const [kinds, yards] = write ? await Promise.all([listTreatmentKinds(true), listYardChoices(user)]) : [[], []];
  const endFeeding = async (feedingId: number, endedOn: string) => {
    'use server';
    return endFeedingAction({ colonyId: colony.id, feedingId, endedOn });
  };
  const endTreatment = async (treatmentId: number, removedOn: string) => {
    'use server';
    return endTreatmentAction({ colonyId: colony.id, treatmentId, removedOn });
  };

  return (
    <>
      <PageHeader
        title={`Colony ${colony.code}`}
        lead={
          <>
            In <Link href={`/admin/yards/${colony.yardId}`}>{colony.yardName}</Link> · keeper {colony.keeperName}
          </>
        }
        actions={
          write ? (
            <>
              <Link href={`/admin/yards/${colony.yardId}/pulls`} className="btn-primary min-h-11">
                Record pulls
              </Link>
              <Link href={`/admin/colonies/${colony.id}/edit`} className="btn-secondary min-h-11">
                Edit
              </Link>
            </>
          ) : null
        }
      />
      <div className="grid gap-4 lg:grid-cols-[1fr_22rem]">
        {/* min-w-0: the supers table scrolls inside its card instead of widening the page on a phone. */}
        <div className="min-w-0 space-y-4">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 card text-sm">
            <dt className="text-ink-soft">Status</dt>
            <dd>
              <ColonyStatusChip status={colony.status} />
              {colony.combinedInto ? (
                <>
                  {' '}
                  into <Link href={`/admin/colonies/${colony.combinedInto.id}`}>{colony.combinedInto.code}</Link>
                </>
              ) : null}
            </dd>
            <dt className="text-ink-soft">Queen</dt>
            <dd>
              <QueenColour year={colony.queenYear} colour={colony.queenColour} />
            </dd>
            <dt className="text-ink-soft">Origin</dt>
            <dd>
              {colony.origin === 'split' ? 'split' : colony.origin}
              {colony.startedOn ? `, started ${colony.startedOn}` : ''}
            </dd>
            <dt className="text-ink-soft">Line</dt>
            <dd>
              {colony.parent ? (
                <>
                  split from <Link href={`/admin/colonies/${colony.parent.id}`}>{colony.parent.code}</Link>
                </>
              ) : (
                'no parent recorded'
              )}
              {colony.splits.length ? (
                <>
                  {' '}
                  · splits:{' '}
                  {colony.splits.map((s, i) => (
                    <span key={s.id}>
                      {i ? ', ' : ''}
                      <Link href={`/admin/colonies/${s.id}`}>{s.code}</Link>
                    </span>
                  ))}
                </>
              ) : null}
            </dd>
            {colony.notes ? (
              <>
                <dt className="text-ink-soft">Notes</dt>
                <dd>{colony.notes}</dd>
              </>
            ) : null}
          </dl>

          <section className="overflow-x-auto card p-0" aria-labelledby="supers-h">
            <h2 id="supers-h" className="px-4 pt-4">
              Supers
            </h2>
            <table className="data-table">
              <TableHead columns={['Pulled', 'Box', 'Tag', num('Full weight'), 'Conflict check']} />
              <tbody>
                {supers.map((s) => {
                  const strike = (x: React.ReactNode) => (s.voided ? <s className="text-ink-soft">{x}</s> : x);
                  return (
                    <tr key={s.id}>
                      <td>
                        {s.pulledOn ? (
                          strike(s.pulledOn)
                        ) : s.voided ? (
                          <span className="text-ink-soft">not on the hive</span>
                        ) : (
                          <Chip tone="info">on hive</Chip>
                        )}
                        {s.putOnOn ? <div className="hint">{strike(`on ${s.putOnOn}`)}</div> : null}
                      </td>
                      <td>{strike(`${s.depth}, ${s.frameCount} fr.`)}</td>
                      <td>{strike(s.tagCode ?? '—')}</td>
                      <td className="num">
                        {strike(
                          s.fullGrams
                            ? fmt(s.fullGrams)
                            : s.cappedFrames != null
                              ? `~${s.cappedFrames} capped fr.`
                              : '—',
                        )}
                      </td>
                      <td>
                        {s.voided ? (
                          <div className="flex flex-col items-start gap-1">
                            <Chip tone="warn">voided</Chip>
                            <VoidedNote v={s.voided} date={voidedOn(s.voided.at)} />
                          </div>
                        ) : s.pulledOn ? (
                          <FlagCell flagged={s.flagged} reasons={s.flagReasons} />
                        ) : (
                          <div className="flex flex-col items-start gap-1">
                            <span className="hint">checked when pulled</span>
                            {canVoid ? (
                              <VoidPullButton
                                record="on"
                                superPullId={s.id}
                                what={superOnWhat(s)}
                                onVoid={voidSuperPullAction}
                              />
                            ) : null}
                          </div>
                        )}
                      </td>
                    </tr>
                  );
                })}
                {supers.length === 0 ? (
                  <tr>
                    <td colSpan={5}>No supers recorded yet.</td>
                  </tr>
                ) : null}
              </tbody>
            </table>
          </section>

          <section className="card" aria-labelledby="timeline-h">
            <h2 id="timeline-h">Timeline</h2>
            <ol className="mt-3 space-y-3">
              {timeline.map((e) => (
                <li key={e.key} className="border-l-4 border-line pl-3">
                  <div className="flex flex-wrap items-center gap-2">
                    <span className="num text-sm text-ink-soft">{e.voided ? <s>{e.on}</s> : e.on}</span>
                    <strong>{e.voided ? <s className="text-ink-soft">{e.title}</s> : e.title}</strong>
                    {e.voided ? (
                      <Chip tone="warn">voided</Chip>
                    ) : e.kind === 'super_pulled' ? (
                      e.flagged ? (
                        <Chip tone="bad">flagged</Chip>
                      ) : (
                        <Chip tone="ok">clear</Chip>
                      )
                    ) : null}
                  </div>
                  <div className="text-sm">
                    {e.voided ? <s className="text-ink-soft">{e.detail}</s> : e.detail}
                    {e.linkColonyId ? (
                      <>
                        {' '}
                        · <Link href={`/admin/colonies/${e.linkColonyId}`}>open</Link>
                      </>
                    ) : null}
                  </div>
                  {e.flagged && !e.voided ? (
                    <ul className="list-disc pl-5 text-sm text-bad-fg">
                      {e.flagReasons?.map((r) => (
                        <li key={r}>{r}</li>
                      ))}
                    </ul>
                  ) : null}
                  <div className="hint">recorded by {e.by ?? 'unknown'}</div>
                  {e.voided ? (
                    <div>
                      <VoidedNote v={e.voided} date={voidedOn(e.voided.at)} />
                    </div>
                  ) : null}
                  {canVoid && e.voidablePullId ? (
                    <VoidPullButton
                      superPullId={e.voidablePullId}
                      what={`the pull of ${e.on}`}
                      onVoid={voidSuperPullAction}
                    />
                  ) : null}
                  {canVoid && e.voidableOnId ? (
                    <VoidPullButton
                      record="on"
                      superPullId={e.voidableOnId}
                      what={`the super on of ${e.on}`}
                      onVoid={voidSuperPullAction}
                    />
                  ) : null}
                  {write && e.openFeedingId ? (
                    <EndRecordForm label="End feeding" today={today} onEnd={endFeeding.bind(null, e.openFeedingId)} />
                  ) : null}
                  {write && e.openTreatmentId ? (
                    <>
                      <TreatmentCaution />
                      <EndRecordForm
                        label="Record removal"
                        today={today}
                        onEnd={endTreatment.bind(null, e.openTreatmentId)}
                      />
                    </>
                  ) : null}
                </li>
              ))}
              {timeline.length === 0 ? <li>Nothing recorded yet.</li> : null}
            </ol>
          </section>
        </div>

        {write ? (
          <aside className="space-y-3">
            <Section title="Super on">
              <SuperOnForm
                colonyId={colony.id}
                today={today}
                tags={freeTags}
                allowUntagged={settings.allowUntaggedSupers}
                onSave={superOnAction}
              />
            </Section>
            <Section title="Feeding">
              <FeedingForm colonyId={colony.id} today={today} onSave={addFeedingAction} />
            </Section>
            <Section title="Mite treatment">
              <TreatmentForm colonyId={colony.id} today={today} kinds={kinds} onSave={addTreatmentAction} />
            </Section>
            <Section title="Note">
              <NoteForm colonyId={colony.id} today={today} onSave={colonyNoteAction} />
            </Section>
            <Section title="Split">
              <SplitForm colonyId={colony.id} today={today} onSave={splitColonyAction} />
            </Section>
            <Section title="Move to another yard">
              <MoveForm
                colonyId={colony.id}
                today={today}
                yards={yards.filter((y) => y.id !== colony.yardId)}
                onSave={moveColonyAction}
              />
            </Section>
            <Section title="Status">
              <StatusForm colonyId={colony.id} today={today} status={colony.status} onSave={colonyStatusAction} />
            </Section>
          </aside>
        ) : null}
      </div>
    </>
  );
}
