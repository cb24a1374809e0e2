// The stack page's structural commands (split a lift, join lifts at a splice): each asks what it needs,
// builds the whole edit with the shared op-builders and sends it as one edit, so it is one undo step and
// the results never go blank half-way.
import { computed } from 'vue';
import { useQuasar } from 'quasar';
import {
  addFloorRestraintOps,
  joinLiftsOps,
  liftAt,
  splitLiftOps,
  StructuralEditError,
  type NewId,
} from '@shared/ops/structuralEdits.ts';
import type { Op } from '@shared/schema/ops.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { formatElevation, levelWord } from '@shared/wording.ts';
import { newId } from '@/utils/clipboardOps.ts';
import { liftNumbers, liftSpans } from '@/utils/stackChain.ts';
import { useNotifyStore } from '@/stores/notify.ts';
import { useStackStore } from '@/stores/stack.ts';

function idMaker(doc: StackDocument): NewId {
  const taken = new Set([...doc.nodes.map((n) => n.id), ...doc.edges.map((e) => e.id)]);
  return (prefix) => newId(prefix, taken);
}

/** Half-way up the lift, to the centimetre: a starting value the engineer replaces. */
const middle = (bottom: number, top: number) => Math.round(((bottom + top) / 2) * 100) / 100;

export function useStructuralEdits() {
  const $q = useQuasar();
  const stack = useStackStore();
  const notify = useNotifyStore();

  const selected = computed(() =>
    stack.selection.length === 1 ? stack.doc?.nodes.find((n) => n.id === stack.selection[0]) : undefined,
  );
  const selectedKind = computed(() => selected.value?.kind ?? null);

  function run(build: (doc: StackDocument) => { ops: Op[]; select: string }, label: string): void {
    const doc = stack.doc;
    if (!doc) return;
    try {
      const { ops, select } = build(doc);
      if (stack.edit(ops, label)) stack.select([select]);
    } catch (e) {
      if (!(e instanceof StructuralEditError)) throw e;
      notify.error(e, `${label} is not possible`);
    }
  }

  function split(): void {
    const doc = stack.doc;
    const lift = selected.value;
    if (!doc || lift?.kind !== 'lift') return;
    const span = liftSpans(doc).get(lift.id);
    const name = liftNumbers(doc).get(lift.id) ?? '';
    const range = span ? ` (it runs from ${formatElevation(span.bottom)} to ${formatElevation(span.top)} m)` : '';
    $q.dialog({
      title: `Split lift ${name}`,
      message: `Elevation of the new splice, m${range}. The lift above it takes the same section and grade, marked to confirm.`,
      prompt: { model: span ? String(middle(span.bottom, span.top)) : '', type: 'number', inputmode: 'decimal' },
      cancel: true,
      ok: { label: 'Split', unelevated: true, color: 'primary' },
    }).onOk((value: string) => {
      run((d) => {
        const r = splitLiftOps(d, lift.id, Number(value), idMaker(d));
        return { ops: r.ops, select: r.spliceId };
      }, `Split lift ${name}`);
    });
  }

  function join(): void {
    const splice = selected.value;
    if (splice?.kind !== 'splice') return;
    run(
      (d) => {
        const r = joinLiftsOps(d, splice.id, idMaker(d));
        return { ops: r.ops, select: r.liftId };
      },
      `Join the lifts at ${formatElevation(splice.data.elevation)}`,
    );
  }

  /** Levels a lift of this stack spans that have no floor restraint yet: where "add a floor" can go. */
  const freeLevels = computed(() => {
    const doc = stack.doc;
    if (!doc) return [];
    const taken = new Set(
      doc.nodes.flatMap((n) => (n.kind === 'restraint' ? [n.data.levelId ?? '', n.data.elevation.toFixed(3)] : [])),
    );
    return stack.levels.filter(
      (l) => !taken.has(l.id) && !taken.has(l.elevation.toFixed(3)) && liftAt(doc, l.elevation) !== null,
    );
  });

  function addFloor(levelId: string): void {
    const level = stack.levels.find((l) => l.id === levelId);
    if (!level) return;
    run(
      (d) => {
        const r = addFloorRestraintOps(d, level, idMaker(d));
        return { ops: r.ops, select: r.restraintId };
      },
      `Add a floor restraint at ${levelWord(level.name)}`,
    );
  }

  return { selectedKind, split, join, freeLevels, addFloor };
}
