// The calculation package of a revision, drawn once and served as stored (docs/faults.md). Copy 0 is
// the issued package: made 'due' in the freeze's transaction, drawn after commit by whichever process
// gets there first (a conditional UPDATE keeps the first drawing), verified against its SHA-256 on
// every read. Revisions frozen before packages were stored get theirs drawn once, on first need.
// A tampered or lost copy 0 is reported, never silently re-drawn; a lead may ask for a re-drawn copy,
// stored as copy 1, 2, … and marked on every page as not the issued package.
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { User } from '../../shared/schema/api.ts';
import type { ServerContext } from '../context.ts';
import { now } from '../db.ts';
import { isUniqueViolation, onUniqueViolation } from '../dbErrors.ts';
import { conflict, HttpError, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { loadSnapshotText } from './revisions.ts';
import { isIssued, loadSignOff } from './reviews.ts';

interface PackageRow {
  id: number;
  revision_id: number;
  copy: number;
  bytes: Buffer | null;
  sha256: string | null;
  reason: string | null;
  drawn_at: string | null;
}

export interface StoredPackage {
  copy: number;
  bytes: Buffer;
  sha256: string;
  reason: string | null;
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

export const packageTampered = (copy: number) =>
  new HttpError(
    500,
    'package_tampered',
    `The stored package${copy ? ` (copy ${copy})` : ''} of this revision does not match its SHA-256: it was changed after it was drawn. A lead can have a re-drawn copy made, marked as such.`,
  );
export const packageMissing = (copy: number) =>
  new HttpError(
    500,
    'package_missing',
    `The stored package${copy ? ` (copy ${copy})` : ''} of this revision has been lost. A lead can have a re-drawn copy made, marked as such.`,
  );

async function packageRow(db: Knex, revisionId: number, copy: number): Promise<PackageRow | undefined> {
  return db<PackageRow>('revision_packages').where({ revision_id: revisionId, copy }).first();
}

/** The stored bytes, checked; throws package_tampered / package_missing. null: not drawn yet. */
function verified(row: PackageRow): StoredPackage | null {
  if (row.sha256 === null) return null;
  if (!row.bytes || row.bytes.length === 0) throw packageMissing(row.copy);
  const bytes = Buffer.from(row.bytes);
  if (sha256(bytes) !== row.sha256) throw packageTampered(row.copy);
  return { copy: row.copy, bytes, sha256: row.sha256, reason: row.reason };
}

/** Drawings in progress in this process, so a download just after a freeze waits for that drawing. */
const drawing = new WeakMap<ServerContext, Map<number, Promise<StoredPackage>>>();

/** The issued package (copy 0), drawn now if it is due or the revision predates stored packages. */
export function issuedPackage(ctx: ServerContext, revisionId: number): Promise<StoredPackage> {
  const inFlight = drawing.get(ctx) ?? new Map<number, Promise<StoredPackage>>();
  drawing.set(ctx, inFlight);
  const known = inFlight.get(revisionId);
  if (known) return known;
  const work = readOrDraw(ctx, revisionId).finally(() => inFlight.delete(revisionId));
  inFlight.set(revisionId, work);
  return work;
}

async function readOrDraw(ctx: ServerContext, revisionId: number): Promise<StoredPackage> {
  const row = await packageRow(ctx.db, revisionId, 0);
  const stored = row ? verified(row) : null;
  if (stored) return stored;
  // A revision awaiting its check or approval has no issued package (only check copies, never stored).
  if (!row && !(await isIssued(ctx.db, revisionId))) throw conflict('This revision is not issued yet');
  const snapshot = await loadSnapshotText(ctx.db, revisionId);
  const bytes = await ctx.offThread.renderPackage(snapshot, { signOff: await loadSignOff(ctx.db, revisionId) });
  const fields = { bytes, sha256: sha256(bytes), size: bytes.length, drawn_at: now() };
  if (row) {
    // Only the first drawing is kept: another process may have stored its own meanwhile.
    await ctx.db('revision_packages').where({ id: row.id }).whereNull('sha256').update(fields);
  } else {
    const reason = 'drawn on first need: the revision was frozen before packages were stored';
    try {
      await ctx
        .db('revision_packages')
        .insert({ revision_id: revisionId, copy: 0, reason, ...fields, created_at: now() });
    } catch (e) {
      // Another process stored its drawing first; that one is kept and read below.
      if (!isUniqueViolation(e)) throw e;
    }
  }
  const again = await packageRow(ctx.db, revisionId, 0);
  const result = again ? verified(again) : null;
  if (!result) throw packageMissing(0);
  return result;
}

export const CHECK_COPY_REASON = 'check copy: not issued';

export const checkCopyMark = (code: string, at: string) =>
  `CHECK COPY of revision ${code}, drawn ${at.slice(0, 10)}: not issued, awaiting its check and approval`;

/**
 * The package of a revision that is not issued yet, for its checker: drawn on each request with the
 * sign-offs so far, marked on every page, never stored or mailed (docs/issue-workflow.md).
 */
async function checkCopy(ctx: ServerContext, revisionId: number): Promise<StoredPackage> {
  const snapshot = await loadSnapshotText(ctx.db, revisionId);
  const bytes = await ctx.offThread.renderPackage(snapshot, {
    mark: checkCopyMark(snapshot.code, now()),
    signOff: await loadSignOff(ctx.db, revisionId),
  });
  return { copy: 0, bytes, sha256: sha256(bytes), reason: CHECK_COPY_REASON };
}

/** Copy 0: the issued package, or a check copy while the revision is not issued; n > 0: a re-drawn copy. */
export async function packageCopy(ctx: ServerContext, revisionId: number, copy: number): Promise<StoredPackage> {
  if (copy === 0)
    return (await isIssued(ctx.db, revisionId)) ? issuedPackage(ctx, revisionId) : checkCopy(ctx, revisionId);
  const row = await packageRow(ctx.db, revisionId, copy);
  const stored = row ? verified(row) : null;
  if (!stored) throw notFound('Package copy');
  return stored;
}

/** Why copy 0 cannot be served, or null when it can (or is simply not drawn yet). */
async function issuedPackageFault(db: Knex, revisionId: number): Promise<HttpError | null> {
  const row = await packageRow(db, revisionId, 0);
  try {
    if (row) verified(row);
    return null;
  } catch (e) {
    if (e instanceof HttpError) return e;
    throw e;
  }
}

export const redrawnMark = (code: string, copy: number, at: string) =>
  `RE-DRAWN COPY ${copy} of revision ${code}, drawn ${at.slice(0, 10)}: not the issued package (which failed its check)`;

/** A marked copy, made only when the issued package is tampered or lost. */
export async function redrawCopy(ctx: ServerContext, revisionId: number, user: User): Promise<StoredPackage> {
  const fault = await issuedPackageFault(ctx.db, revisionId);
  if (!fault) throw conflict('The issued package is intact; only a tampered or lost package may be re-drawn');
  const snapshot = await loadSnapshotText(ctx.db, revisionId);
  const at = now();
  const copies = await ctx
    .db('revision_packages')
    .where({ revision_id: revisionId })
    .max<{ m: number | null }[]>({ m: 'copy' });
  const copy = Number(copies[0]?.m ?? 0) + 1;
  const bytes = await ctx.offThread.renderPackage(snapshot, {
    mark: redrawnMark(snapshot.code, copy, at),
    signOff: await loadSignOff(ctx.db, revisionId),
  });
  const reason = `re-drawn by ${user.name}: ${fault.code}`;
  await onUniqueViolation(
    () =>
      ctx.db('revision_packages').insert({
        revision_id: revisionId,
        copy,
        bytes,
        sha256: sha256(bytes),
        size: bytes.length,
        reason,
        drawn_by: user.id,
        drawn_at: at,
        created_at: at,
      }),
    () => conflict('Another re-drawn copy was made at the same moment; reload'),
  );
  await recordAudit(ctx.db, {
    userId: user.id,
    buildingId: snapshot.buildingId,
    action: 'revision.redraw',
    detail: { revisionId, copy, reason },
  });
  return { copy, bytes, sha256: sha256(bytes), reason };
}
