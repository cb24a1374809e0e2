// Cover sheet: what was issued, when, by whom, on what basis, and the hash that identifies it.
import type { SignOff } from '../../shared/schema/reviews.ts';
import type { RevisionSnapshot } from '../../shared/schema/revisions.ts';
import { robustnessSummary } from '../../shared/engine/connections/robustnessSummary.ts';
import { frozenDate, metres } from './format.ts';
import { COLOUR, CONTENT_BOTTOM, FONT, FULL_WIDTH, MARGIN, SIZE } from './layout.ts';
import type { Pdf } from './pdf.ts';
import { hasCombined } from './utilisations.ts';

const ANNEX_WORDS = { UK: 'UK National Annexes', EN: 'recommended values of the Eurocodes' } as const;

/** Absent means on (options stored before the switch existed). */
export const momentsOn = (s: Pick<RevisionSnapshot, 'options'>) => s.options.nominalMoments !== false;

export function nominalMomentsWords(s: RevisionSnapshot): string {
  if (!momentsOn(s)) return 'not included: axial checks only, any beam reactions given on column faces are ignored';
  const stacks = s.stacks.filter((st) => hasCombined(st.results)).length;
  const where =
    stacks === 0
      ? 'no stack has beam reactions on its column faces'
      : `applied in ${stacks} of ${s.stacks.length} stack${s.stacks.length === 1 ? '' : 's'}`;
  return `included (simple construction): beam reactions on the column faces, combined check with the axial force (N+M); ${where}`;
}

function field(
  doc: Pdf,
  label: string,
  value: string,
  y: number,
  opts: { bold?: boolean; colour?: string } = {},
): number {
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.muted)
    .text(label, MARGIN.left, y, { width: 130, lineBreak: false });
  doc
    .font(opts.bold ? FONT.bold : FONT.regular)
    .fontSize(SIZE.body + 1)
    .fillColor(opts.colour ?? COLOUR.ink)
    .text(value, MARGIN.left + 140, y - 1, { width: FULL_WIDTH - 140 });
  return Math.max(doc.y, y + 14) + 4;
}

/** Where a block of `height` starting at y goes: here, or at the top of a new page when it would not fit. */
function keepTogether(doc: Pdf, y: number, height: number): number {
  if (y + height <= CONTENT_BOTTOM) return y;
  doc.addPage();
  return MARGIN.top;
}

function boxed(doc: Pdf, title: string, body: string, y: number, colour: string): number {
  doc.font(FONT.regular).fontSize(SIZE.body + 0.5);
  const h = doc.heightOfString(body, { width: FULL_WIDTH - 20 }) + 28;
  // A box is never split across pages: a long note or reason takes the cover onto a second page whole.
  if (y + h > CONTENT_BOTTOM) {
    doc.addPage();
    y = MARGIN.top;
  }
  doc.rect(MARGIN.left, y, FULL_WIDTH, h).lineWidth(0.8).stroke(colour);
  doc
    .font(FONT.bold)
    .fontSize(SIZE.body)
    .fillColor(colour)
    .text(title, MARGIN.left + 10, y + 8, { lineBreak: false });
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body + 0.5)
    .fillColor(COLOUR.ink)
    .text(body, MARGIN.left + 10, y + 20, { width: FULL_WIDTH - 20 });
  return y + h + 12;
}

/** Prepared / checked / approved with names and dates, side by side under the revision (docs/issue-workflow.md). */
function drawSignOff(doc: Pdf, o: SignOff, y: number): number {
  const checked = o.checked
    ? { name: o.checked.name, at: o.checked.at, colour: COLOUR.ink }
    : o.unchecked
      ? { name: 'Preliminary — not checked', at: null, colour: COLOUR.fail }
      : { name: 'awaiting check', at: null, colour: COLOUR.muted };
  const cells = [
    { label: 'Prepared by', name: o.prepared.name, at: o.prepared.at, colour: COLOUR.ink },
    { label: 'Checked by', ...checked },
    o.approved
      ? { label: 'Approved by', name: o.approved.name, at: o.approved.at, colour: COLOUR.ink }
      : { label: 'Approved by', name: 'awaiting approval', at: null, colour: COLOUR.muted },
  ];
  const width = FULL_WIDTH / cells.length;
  let bottom = y;
  cells.forEach((c, i) => {
    const x = MARGIN.left + i * width;
    doc
      .font(FONT.regular)
      .fontSize(SIZE.body + 1)
      .fillColor(COLOUR.muted)
      .text(`${c.label} `, x, y, { width: width - 10, continued: true })
      .font(FONT.bold)
      .fillColor(c.colour)
      .text(c.name);
    if (c.at)
      doc
        .font(FONT.regular)
        .fontSize(SIZE.body)
        .fillColor(COLOUR.muted)
        .text(frozenDate(c.at), x, doc.y + 1);
    bottom = Math.max(bottom, doc.y);
  });
  doc
    .moveTo(MARGIN.left, bottom + 6)
    .lineTo(MARGIN.left + FULL_WIDTH, bottom + 6)
    .lineWidth(0.5)
    .stroke(COLOUR.rule);
  return bottom + 14;
}

export function drawCover(doc: Pdf, s: RevisionSnapshot, hash: string, signOff: SignOff | null = null): void {
  doc.addPage();
  let y = MARGIN.top + 30;
  doc
    .font(FONT.bold)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.accent)
    .text('STEEL COLUMN DESIGN · CALCULATION PACKAGE', MARGIN.left, y, { characterSpacing: 1 });
  doc
    .font(FONT.bold)
    .fontSize(SIZE.title + 6)
    .fillColor(COLOUR.ink)
    .text(s.building.name, MARGIN.left, y + 18, { width: FULL_WIDTH });
  y = doc.y + 4;
  if (s.building.reference) {
    doc
      .font(FONT.regular)
      .fontSize(SIZE.h2)
      .fillColor(COLOUR.muted)
      .text(`Job reference ${s.building.reference}`, MARGIN.left, y);
    y = doc.y;
  }
  y += 18;
  doc.rect(MARGIN.left, y, 150, 54).fill(COLOUR.accent);
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body)
    .fillColor('#ffffff')
    .text('Revision', MARGIN.left + 12, y + 8, { lineBreak: false });
  doc
    .font(FONT.bold)
    .fontSize(SIZE.title + 4)
    .text(s.code, MARGIN.left + 12, y + 20, { lineBreak: false });
  const purpose = s.purpose === 'construction' ? 'For construction' : 'Preliminary';
  doc
    .font(FONT.bold)
    .fontSize(SIZE.h1)
    .fillColor(COLOUR.ink)
    .text(purpose, MARGIN.left + 168, y + 10, { lineBreak: false });
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body + 1)
    .fillColor(COLOUR.muted)
    .text(
      signOff?.approved ? `Issued ${frozenDate(signOff.approved.at)}` : `Frozen ${frozenDate(s.frozenAt)}`,
      MARGIN.left + 168,
      y + 32,
      { lineBreak: false },
    );
  y += 78;

  const liftCount = s.stacks.reduce((n, st) => n + st.results.lifts.length, 0);
  // Revisions frozen before checking existed name only who froze them.
  y = signOff ? drawSignOff(doc, signOff, y) : field(doc, 'Frozen by', `${s.frozenBy.name} <${s.frozenBy.email}>`, y);
  y = field(
    doc,
    'Content',
    `${s.stacks.length} stack${s.stacks.length === 1 ? '' : 's'}, ${liftCount} lifts, ${s.levels.length} levels`,
    y,
  );
  const combination =
    s.options.combination === '6.10' ? 'EN 1990 eq. 6.10' : 'EN 1990 eq. 6.10a and 6.10b, the less favourable';
  y = field(doc, 'Load combination', combination, y);
  y = field(doc, 'Partial and ψ factors', ANNEX_WORDS[s.options.annex], y);
  y = field(
    doc,
    'Imposed-load reduction',
    s.options.imposedReduction ? 'αn for the number of storeys, EN 1991-1-1 6.3.1.2(11)' : 'not applied',
    y,
  );
  y = field(doc, 'Self-weight of columns', s.options.selfWeight ? 'included' : 'not included', y);
  y = field(doc, 'Nominal moments', nominalMomentsWords(s), y);
  y = field(
    doc,
    'Member design',
    `EN 1993-1-1: classification (Table 5.2), cross-section resistance (6.2.4) and flexural buckling (6.3.1)${momentsOn(s) ? '; with nominal moments, bending resistance (6.2.5) and lateral-torsional buckling (6.3.2)' : ''}`,
    y,
  );
  y = field(
    doc,
    'Consequence class',
    s.options.consequenceClass ? `${s.options.consequenceClass} (EN 1991-1-7 Annex A)` : 'not given',
    y,
  );
  const ties = robustnessSummary(
    { stacks: s.stacks.map((st) => ({ id: st.id, name: st.name, result: st.results })) },
    s.options.consequenceClass,
  );
  y = field(
    doc,
    'Robustness',
    ties.message +
      (ties.notMeeting.length
        ? `: ${ties.notMeeting.map((r) => `${r.stackName} ${metres(r.elevation)}`).join(', ')}`
        : ''),
    y,
    {
      colour: ties.notMeeting.length ? COLOUR.fail : undefined,
    },
  );
  y = field(doc, 'Foundation concrete', s.options.concreteClass ?? 'not given', y);
  y = field(doc, 'Engine version', s.engineVersion, y);
  y += 8;
  if (s.note) y = boxed(doc, 'NOTE', s.note, y, COLOUR.accent);
  if (s.acknowledgement) y = boxed(doc, 'FAILING LIFTS ACKNOWLEDGED', s.acknowledgement, y, COLOUR.fail);
  if (signOff?.openCommentsReason) {
    const open = signOff.openComments.map((c) => `${c.stack}${c.lift ? ` ${c.lift}` : ''} (${c.by}): ${c.text}`);
    const body = `${signOff.approved?.name ?? 'The lead'}: ${signOff.openCommentsReason}\nOpen: ${open.join('; ')}`;
    y = boxed(doc, 'APPROVED WITH CHECK COMMENTS OPEN', body, y, COLOUR.fail);
  }

  y = keepTogether(doc, y, 50);
  doc
    .font(FONT.bold)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.ink)
    .text('Snapshot SHA-256', MARGIN.left, y + 4);
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body)
    .fillColor(COLOUR.muted)
    .text(hash, MARGIN.left, doc.y + 2, { characterSpacing: 0.3 });
  doc.text(
    'The hash covers the frozen documents, results, levels and options; the same hash means the same content.',
    MARGIN.left,
    doc.y + 2,
    { width: FULL_WIDTH },
  );

  const contentsY = keepTogether(doc, doc.y + 22, 110);
  doc.font(FONT.bold).fontSize(SIZE.h2).fillColor(COLOUR.ink).text('Contents', MARGIN.left, contentsY);
  doc
    .font(FONT.regular)
    .fontSize(SIZE.body + 0.5)
    .fillColor(COLOUR.ink);
  const entry = (text: string, gap: number) => doc.text(text, MARGIN.left + 8, doc.y + gap, { width: FULL_WIDTH - 8 });
  entry('1  Summary of stacks and levels', 4);
  entry(
    '2  Each stack: elevation, load take-down by level, member checks of every lift, then its splices and base, with their working',
    2,
  );
  entry('3  Column schedule and tonnage', 2);
  entry(
    'Units: m and kN for the stack; mm, N/mm², kN, kN·m, cm³ and cm⁴ in the member working. References to clauses and equations are in the right-hand margin.',
    8,
  );
}
