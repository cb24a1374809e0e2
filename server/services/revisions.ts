// Freezing (preparing) and reading revisions (docs/contracts.md §Revisions, docs/issue-workflow.md). One transaction
// snapshots the building; the rows are never changed afterwards (database triggers refuse it). A revision is
// issued (package due, mail queued) when approved (revisionIssue.ts), or at once by a lead's preliminary freeze.
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import type { ReviewSummary } from '../../shared/schema/reviews.ts';
import {
  REVISION_PREFIX,
  type FreezeRefusal,
  type MailStatus,
  type RevisionDetail,
  type RevisionPurpose,
  type RevisionSnapshot,
  type RevisionSummary,
  type SnapshotStack,
} from '../../shared/schema/revisions.ts';
import type { IssueHead } from './revisionsMail.ts';
import { conflict, notFound, unprocessable } from '../errors.ts';
import { isPostgres, now } from '../db.ts';
import { onUniqueViolation } from '../dbErrors.ts';
import { summariseResult } from './analysis.ts';
import { recordAudit } from './audit.ts';
import { listRecipients } from './revisionsRecipients.ts';
import { queueIssue } from './revisionIssue.ts';
import { loadSignOff, recordStep, reviewSummaries } from './reviews.ts';
import { addGoverningWorking, sha256HexInTurns, snapshotStacks, takeSnapshot } from './snapshot.ts';

export interface RevisionRow {
  id: number;
  building_id: number;
  code: string;
  purpose: RevisionPurpose;
  note: string;
  acknowledgement: string | null;
  hash: string;
  engine_version: string;
  frozen_by: number;
  frozen_by_name: string;
  frozen_at: string;
  stack_count: number;
  worst_utilisation: number | null;
  failing_lifts: number;
}
const SUMMARY_COLUMNS = [
  'id',
  'building_id',
  'code',
  'purpose',
  'note',
  'acknowledgement',
  'hash',
  'engine_version',
  'frozen_by',
  'frozen_by_name',
  'frozen_at',
  'stack_count',
  'worst_utilisation',
  'failing_lifts',
];

export interface FreezeInput {
  /** Where the e-mail's link points (the revisions page of the building). */
  link: string;
  /** See freezeBodySchema: the newest revision the sender has seen; undefined when not said. */
  afterRevisionId?: number | null;
  note: string;
  purpose: RevisionPurpose;
  acknowledgeFailingLifts: boolean;
  engineVersion: string;
  /**
   * Issue at once as a preliminary issue without a check (the lead's freeze of a preliminary revision);
   * otherwise the revision is prepared and waits for its check and approval (docs/issue-workflow.md).
   */
  issueUnchecked: boolean;
}

interface FailingLift {
  stackId: number;
  stack: string;
  liftId: string;
  /** L1, L2, … as people read it (the node id is only for linking). */
  label: string;
  section: string;
  utilisation: number;
}

/** Validation errors stop a freeze; they are returned as the 422's reasons. */
function validationReasons(stacks: SnapshotStack[]): FreezeRefusal['reasons'] {
  const reasons: FreezeRefusal['reasons'] = [];
  for (const s of stacks) {
    for (const e of s.results.errors)
      reasons.push({ stackId: s.id, stack: s.name, ...(e.nodeId ? { nodeId: e.nodeId } : {}), message: e.message });
    if (s.results.errors.length === 0 && s.results.lifts.length === 0)
      reasons.push({ stackId: s.id, stack: s.name, message: 'The stack has no lifts to check' });
    // A typical column's further positions (docs/typical-columns.md): errors there stop a freeze too.
    for (const p of s.results.positions ?? [])
      if (p.positionId !== null)
        for (const message of p.errors) reasons.push({ stackId: s.id, stack: `${s.name} at ${p.name}`, message });
  }
  return reasons;
}

// EN 1993-1-1 6.3.1.1(1): NEd/Nb,Rd ≤ 1.0; a lift above 1.0 fails.
const failingLifts = (stacks: SnapshotStack[]): FailingLift[] =>
  stacks.flatMap((s) =>
    s.results.lifts
      .filter((l) => l.utilisation > 1)
      .map((l) => ({
        stackId: s.id,
        stack: s.name,
        liftId: l.liftId,
        label: l.label ?? 'lift',
        section: l.section,
        utilisation: l.utilisation,
      }))
      .concat(
        // A typical column fails where any of its further positions fails (docs/typical-columns.md).
        (s.results.positions ?? [])
          .filter((p) => p.positionId !== null)
          .flatMap((p) =>
            p.lifts
              .filter((l) => l.utilisation > 1)
              .map((l) => ({
                stackId: s.id,
                stack: `${s.name} at ${p.name}`,
                liftId: l.liftId,
                label: l.label,
                section: s.results.lifts.find((own) => own.liftId === l.liftId)?.section ?? '',
                utilisation: l.utilisation,
              })),
          ),
      ),
  );

function acknowledgementText(failing: FailingLift[], user: User): string {
  const list = failing.map((f) => `${f.stack} ${f.label} (${f.section}, ${f.utilisation.toFixed(3)})`).join('; ');
  return `${user.name} issued this revision knowing that ${failing.length} lift${failing.length === 1 ? '' : 's'} exceed utilisation 1.0: ${list}`;
}

async function nextCode(trx: Knex, buildingId: number, purpose: RevisionPurpose): Promise<string> {
  const prefix = REVISION_PREFIX[purpose];
  const codes = await trx('revisions').where({ building_id: buildingId, purpose }).pluck<string[]>('code');
  const highest = codes.reduce((m, c) => Math.max(m, Number(c.slice(prefix.length)) || 0), 0);
  return `${prefix}${String(highest + 1).padStart(2, '0')}`;
}

/** What a freeze gives back: the new revision, its outline and whether it was issued at once. */
export interface FrozenRevision {
  id: number;
  outline: RevisionOutline;
  hash: string;
  issued: boolean;
}

/**
 * Freezes are serialised per building by locking the building's row (PostgreSQL; SQLite has one
 * writer). A freeze that finds a revision frozen after its request arrived is refused (409) rather
 * than issuing a second revision its sender never saw. `afterRevisionId` (sent by the app) makes this
 * exact: parallel or retried freezes give one revision. Without it, `arrivedAt` (when the request
 * reached this process) catches the requests that arrived before another freeze committed.
 * Takes freezeIn's arguments: the database, the building, the freeze's input, its sender and the arrival time.
 */
export async function freezeRevision(...args: Parameters<typeof freezeIn>): Promise<FrozenRevision> {
  return onUniqueViolation(
    () => freezeIn(...args),
    () =>
      conflict('Another freeze of this building took the same revision code at the same moment; reload the revisions'),
  );
}

async function freezeIn(
  db: Knex,
  buildingId: number,
  input: FreezeInput,
  user: User,
  arrivedAt: string,
): Promise<FrozenRevision> {
  if (input.issueUnchecked && input.purpose !== 'preliminary')
    throw conflict('Only a preliminary revision may be issued without a check');
  return db.transaction(async (trx) => {
    const buildingQuery = trx('buildings').where({ id: buildingId });
    if (isPostgres(trx)) buildingQuery.forUpdate();
    const building = await buildingQuery.first<{ id: number; name: string; reference: string } | undefined>(
      'id',
      'name',
      'reference',
    );
    if (!building) throw notFound('Building');
    const unseen = await trx('revisions')
      .where({ building_id: buildingId })
      .andWhere('frozen_at', '>=', arrivedAt)
      .orderBy('id', 'desc')
      .first<{ id: number; code: string } | undefined>('id', 'code');
    const newest = await trx('revisions')
      .where({ building_id: buildingId })
      .orderBy('id', 'desc')
      .first<{ id: number; code: string } | undefined>('id', 'code');
    if (input.afterRevisionId !== undefined && (newest?.id ?? null) !== input.afterRevisionId) {
      if (!newest) throw conflict('The revision this freeze was based on does not exist; reload the revisions');
      throw conflict(
        `Revision ${newest.code} is newer than the one this freeze was based on; check it, and freeze again only if another revision is needed`,
        { revisionId: newest.id },
      );
    }
    if (unseen) {
      throw conflict(
        `Revision ${unseen.code} was frozen while this freeze was on its way; check it, and freeze again only if another revision is needed`,
        { revisionId: unseen.id },
      );
    }
    const stacks = await snapshotStacks(trx, buildingId);
    if (stacks.length === 0)
      throw unprocessable('The building has no stacks to freeze', { reasons: [] } satisfies FreezeRefusal);
    const reasons = validationReasons(stacks);
    if (reasons.length > 0)
      throw unprocessable(`${reasons.length} problem${reasons.length === 1 ? '' : 's'} must be fixed before freezing`, {
        reasons,
      } satisfies FreezeRefusal);
    const failing = failingLifts(stacks);
    if (failing.length > 0 && (!input.acknowledgeFailingLifts || input.note.trim() === '')) {
      const message = `${failing.length} lift${failing.length === 1 ? '' : 's'} exceed utilisation 1.0: acknowledge this and say why in the note to freeze anyway`;
      throw unprocessable(message, {
        reasons: failing.map((f) => ({
          stackId: f.stackId,
          stack: f.stack,
          nodeId: f.liftId,
          message: `Lift ${f.label} (${f.section}) has utilisation ${f.utilisation.toFixed(3)}`,
        })),
      } satisfies FreezeRefusal);
    }
    await addGoverningWorking(trx, buildingId, stacks);
    const code = await nextCode(trx, buildingId, input.purpose);
    const frozenAt = now();
    const acknowledgement = failing.length > 0 ? acknowledgementText(failing, user) : null;
    const { snapshot, text, hash } = await takeSnapshot(
      trx,
      {
        building,
        code,
        purpose: input.purpose,
        note: input.note,
        acknowledgement,
        frozenAt,
        frozenBy: { id: user.id, name: user.name, email: user.email },
        engineVersion: input.engineVersion,
      },
      stacks,
    );
    const outline = outlineOf(snapshot);
    const utilisations = outline.stacks.map((s) => s.utilisation).filter((u): u is number => u !== null);
    const [row] = await trx('revisions')
      .insert({
        building_id: buildingId,
        code,
        purpose: input.purpose,
        note: input.note,
        acknowledgement,
        snapshot: text,
        hash,
        engine_version: input.engineVersion,
        frozen_by: user.id,
        frozen_by_name: user.name,
        frozen_at: frozenAt,
        stack_count: stacks.length,
        worst_utilisation: utilisations.length > 0 ? Math.max(...utilisations) : null,
        failing_lifts: failing.length,
      })
      .returning<{ id: number }[]>('id');
    await storeOutline(trx, row.id, hash, outline);
    // The preparer signs first; a preliminary freeze by a lead is approved and issued in the same breath.
    await recordStep(trx, row.id, 'prepared', user, frozenAt);
    if (input.issueUnchecked) {
      await recordStep(trx, row.id, 'approved', user, frozenAt, { unchecked: true });
      // The package is due (drawn once after commit, revisionPackages.ts) and each member's e-mail is
      // queued in this transaction, so a crash after commit still sends it (mailSender.ts).
      await queueIssue(trx, {
        revisionId: row.id,
        head: { ...snapshot, stackCount: snapshot.stacks.length },
        hash,
        link: input.link,
        at: frozenAt,
        signOff: await loadSignOff(trx, row.id),
      });
    }
    await recordAudit(trx, {
      userId: user.id,
      buildingId,
      action: input.issueUnchecked ? 'revision.freeze' : 'revision.prepare',
      detail: { revisionId: row.id, code, hash, failingLifts: failing.length },
    });
    return { id: row.id, outline, hash, issued: input.issueUnchecked };
  });
}

async function mailCounts(db: Knex, revisionIds: number[]): Promise<Map<number, Record<MailStatus, number>>> {
  const counts = new Map<number, Record<MailStatus, number>>(
    revisionIds.map((id) => [id, { pending: 0, sent: 0, failed: 0 }]),
  );
  if (revisionIds.length === 0) return counts;
  const rows = await db('revision_recipients')
    .whereIn('revision_id', revisionIds)
    .groupBy('revision_id', 'status')
    .select<{ revision_id: number; status: MailStatus; n: number | string }[]>(
      'revision_id',
      'status',
      db.raw('count(*) as n'),
    );
  for (const r of rows) {
    const c = counts.get(r.revision_id);
    if (c) c[r.status] = Number(r.n);
  }
  return counts;
}

function toSummary(row: RevisionRow, mail: Record<MailStatus, number>, review: ReviewSummary): RevisionSummary {
  return {
    id: row.id,
    buildingId: row.building_id,
    code: row.code,
    purpose: row.purpose,
    note: row.note,
    frozenAt: row.frozen_at,
    frozenBy: { id: row.frozen_by, name: row.frozen_by_name },
    hash: row.hash,
    stackCount: row.stack_count,
    worstUtilisation: row.worst_utilisation === null ? null : Number(row.worst_utilisation),
    failingLifts: row.failing_lifts,
    mail,
    review,
  };
}

export async function listRevisions(db: Knex, buildingId: number): Promise<RevisionSummary[]> {
  const rows = await db('revisions')
    .where({ building_id: buildingId })
    .orderBy('id', 'desc')
    .select<RevisionRow[]>(SUMMARY_COLUMNS);
  const [counts, reviews] = await Promise.all([
    mailCounts(
      db,
      rows.map((r) => r.id),
    ),
    reviewSummaries(db, rows),
  ]);
  return rows.map((r) => toSummary(r, counts.get(r.id) ?? { pending: 0, sent: 0, failed: 0 }, reviewOf(reviews, r)));
}

function reviewOf(reviews: Map<number, ReviewSummary>, row: RevisionRow): ReviewSummary {
  const review = reviews.get(row.id);
  if (!review) throw new Error(`Revision ${row.id}: no review record`);
  return review;
}

async function loadRevisionRow(db: Knex, id: number): Promise<RevisionRow> {
  const row = await db('revisions')
    .where({ id })
    .first<RevisionRow | undefined>(...SUMMARY_COLUMNS);
  if (!row) throw notFound('Revision');
  return row;
}

/** A frozen snapshot's text as stored, with what names it; a text whose hash no longer matches is refused. */
export interface SnapshotText {
  text: string;
  hash: string;
  code: string;
  buildingId: number;
  stackCount: number;
}

export async function loadSnapshotText(db: Knex, id: number): Promise<SnapshotText> {
  const row = await db('revisions')
    .where({ id })
    .first<{ snapshot: string; hash: string; code: string; building_id: number; stack_count: number } | undefined>(
      'snapshot',
      'hash',
      'code',
      'building_id',
      'stack_count',
    );
  if (!row) throw notFound('Revision');
  if ((await sha256HexInTurns(row.snapshot)) !== row.hash)
    throw new Error(`Revision ${id}: the stored snapshot does not match its hash`);
  return {
    text: row.snapshot,
    hash: row.hash,
    code: row.code,
    buildingId: row.building_id,
    stackCount: Number(row.stack_count),
  };
}

/**
 * A snapshot's fields but its stacks, read from its text without parsing the stacks: the text is canonical JSON,
 * keys sorted, so every top-level field but `stacks` stands before it (and `,"stacks":[` cannot stand inside a
 * string, where a quote is escaped).
 */
function headOf(text: string): Omit<RevisionSnapshot, 'stacks'> {
  const cut = text.indexOf(',"stacks":[');
  try {
    return JSON.parse(cut >= 0 ? `${text.slice(0, cut)}}` : text) as RevisionSnapshot;
  } catch {
    return JSON.parse(text) as RevisionSnapshot;
  }
}

/** The frozen building and code of a revision, for names (a package's file name). */
export async function loadSnapshotHead(db: Knex, id: number): Promise<Pick<RevisionSnapshot, 'building' | 'code'>> {
  const row = await db('revisions').where({ id }).first<{ snapshot: string } | undefined>('snapshot');
  if (!row) throw notFound('Revision');
  const head = headOf(row.snapshot);
  return { building: head.building, code: head.code };
}

/**
 * What a revision's issue e-mail says of it (revisionMessage): its snapshot's head, the text checked against its
 * hash a megabyte at a time, and how many stacks were frozen, from the revision's row. The stacks are not parsed.
 */
export async function loadIssueHead(db: Knex, id: number): Promise<{ head: IssueHead; hash: string }> {
  const { text, hash, stackCount } = await loadSnapshotText(db, id);
  return { head: { ...headOf(text), stackCount }, hash };
}

/** The snapshot as frozen, parsed; a text whose hash no longer matches is refused rather than printed. */
export async function loadSnapshot(db: Knex, id: number): Promise<{ snapshot: RevisionSnapshot; hash: string }> {
  const { text, hash } = await loadSnapshotText(db, id);
  // Written by freezeRevision from validated documents and our engine's results.
  return { snapshot: JSON.parse(text) as RevisionSnapshot, hash };
}

/** What a revision's page shows of its snapshot: the options, levels, and each stack's outcome and lifts. */
export type RevisionOutline = Pick<RevisionDetail, 'options' | 'levels' | 'stacks'>;

function outlineOf(snapshot: Pick<RevisionSnapshot, 'options' | 'levels' | 'stacks'>): RevisionOutline {
  return {
    options: snapshot.options,
    levels: snapshot.levels,
    stacks: snapshot.stacks.map((s) => {
      const sum = summariseResult(s.doc, s.results);
      return {
        id: s.id,
        name: s.name,
        version: s.version,
        governingLiftId: sum.governingLiftId,
        governingLiftLabel: sum.governingLiftLabel,
        governingSection: sum.governingSection,
        utilisation: sum.utilisation,
        status: sum.status,
        lifts: s.results.lifts.map((l) => ({ liftId: l.liftId, label: l.label ?? 'lift' })),
      };
    }),
  };
}

/**
 * A revision's outline as stored beside it (written at the freeze, docs/contracts.md §Revisions), so a read does not
 * parse a snapshot of several megabytes. One missing (a revision frozen before outlines were kept) or drawn from
 * another snapshot than the revision's (`hash`) is drawn again from the snapshot, whose hash is checked, and kept.
 */
async function loadOutline(db: Knex, id: number, hash: string): Promise<RevisionOutline> {
  const row = await db('revision_outlines')
    .where({ revision_id: id })
    .first<{ hash: string; outline: string } | undefined>('hash', 'outline');
  // Written by storeOutline from our own snapshot.
  if (row?.hash === hash) return JSON.parse(row.outline) as RevisionOutline;
  const { snapshot } = await loadSnapshot(db, id);
  const outline = outlineOf(snapshot);
  if (row)
    await db('revision_outlines')
      .where({ revision_id: id })
      .update({ hash, outline: JSON.stringify(outline) });
  else await storeOutline(db, id, hash, outline);
  return outline;
}

/** A revision's outline (what its page shows of the snapshot) and its code, for a check comment's names. */
export async function revisionOutline(db: Knex, id: number): Promise<RevisionOutline & { code: string }> {
  const row = await loadRevisionRow(db, id);
  return { ...(await loadOutline(db, id, row.hash)), code: row.code };
}

async function storeOutline(db: Knex, revisionId: number, hash: string, outline: RevisionOutline): Promise<void> {
  await db('revision_outlines')
    .insert({ revision_id: revisionId, hash, outline: JSON.stringify(outline) })
    .onConflict('revision_id')
    .ignore();
}

/** `frozen`: the outline of the revision just frozen, when the caller has it, so it is not read back. */
export async function getRevision(db: Knex, id: number, frozen?: RevisionOutline): Promise<RevisionDetail> {
  const row = await loadRevisionRow(db, id);
  const [outline, counts, recipients, reviews] = await Promise.all([
    frozen ?? loadOutline(db, id, row.hash),
    mailCounts(db, [id]),
    listRecipients(db, id),
    reviewSummaries(db, [row]),
  ]);
  return {
    ...toSummary(row, counts.get(id) ?? { pending: 0, sent: 0, failed: 0 }, reviewOf(reviews, row)),
    engineVersion: row.engine_version,
    acknowledgement: row.acknowledgement,
    ...outline,
    recipients,
  };
}

/** The building a revision belongs to (for the access policy); null when there is no such revision. */
export async function buildingOfRevisionId(db: Knex, id: number): Promise<number | null> {
  const row = await db('revisions').where({ id }).first<{ building_id: number } | undefined>('building_id');
  return row ? row.building_id : null;
}
