// Typical columns (docs/typical-columns.md): where the building's stacks also stand and each position's check,
// for the plan view and the stack page. Writes go to the server, which re-analyses the stack; the reply and
// the live channel are the truth.
import { shallowRef } from 'vue';
import { defineStore } from 'pinia';
import type { BuildingStackChanged } from '@shared/schema/socket.ts';
import type { AddStackPositionBody, PositionResult, StackPositionsReply } from '@shared/schema/stackPositions.ts';
import { stackPositionsApi } from '@/api/stackPositions.ts';
import { useNotifyStore } from './notify.ts';

export interface TypeChecks {
  results: PositionResult[];
  governingPosition: string | null;
}

export const useStackPositionsStore = defineStore('stackPositions', () => {
  const notify = useNotifyStore();
  const buildingId = shallowRef<number | null>(null);
  /** Stacks standing at more than one position, by stack id. */
  const byStack = shallowRef<Map<number, TypeChecks>>(new Map());

  function set(stackId: number, checks: TypeChecks | null): void {
    const next = new Map(byStack.value);
    if (checks?.results.length) next.set(stackId, checks);
    else next.delete(stackId);
    byStack.value = next;
  }

  async function loadBuilding(id: number): Promise<void> {
    if (buildingId.value !== id) byStack.value = new Map();
    buildingId.value = id;
    try {
      const reply = await stackPositionsApi.ofBuilding(id);
      byStack.value = new Map(reply.stacks.map((s) => [s.stackId, s]));
    } catch (e) {
      notify.error(e, 'Could not load the positions of typical columns');
    }
  }

  function applyStackChange(change: BuildingStackChanged): void {
    if (change.buildingId !== buildingId.value) return;
    set(
      change.stackId,
      change.positions ? { results: change.positions, governingPosition: change.governingPosition ?? null } : null,
    );
  }

  const take = (reply: StackPositionsReply) => set(reply.stackId, reply);

  async function add(stackId: number, body: AddStackPositionBody): Promise<StackPositionsReply | null> {
    try {
      const reply = await stackPositionsApi.add(stackId, body);
      take(reply);
      return reply;
    } catch (e) {
      notify.error(e, 'Could not add the position');
      return null;
    }
  }

  async function remove(stackId: number, positionId: number): Promise<StackPositionsReply | null> {
    try {
      const reply = await stackPositionsApi.remove(stackId, positionId);
      take(reply);
      return reply;
    } catch (e) {
      notify.error(e, 'Could not remove the position');
      return null;
    }
  }

  /** What a page that shows typical columns adds to its live building: their positions, kept up to date. */
  const live = { load: loadBuilding, onStackChange: applyStackChange };

  return { buildingId, byStack, loadBuilding, applyStackChange, live, add, remove };
});
