// Buildings: the list, and the open building with its stacks. Its levels and members have their own stores
// (levels.ts, members.ts); opening a building fills the levels.
// Actions report failures through the notifier and answer whether they succeeded, so forms can stay open.
import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import {
  ROLE_RANK,
  type Building,
  type BuildingSummary,
  type CreateBuildingBody,
  type CreateStackBody,
  type Role,
  type StackSummary,
} from '@shared/schema/api.ts';
import type { AnalysisOptions } from '@shared/schema/results.ts';
import type { Placement } from '@shared/schema/building.ts';
import type { BuildingStackChanged } from '@shared/schema/socket.ts';
import * as buildingsApi from '@/api/buildings.ts';
import { listLevels } from '@/api/levels.ts';
import * as stacksApi from '@/api/stacks.ts';
import { useLoad } from '@/composables/useLoad.ts';
import { attempt as attemptWith } from './attempt.ts';
import { useLevelsStore } from './levels.ts';
import { useMembersStore } from './members.ts';
import { describeError, useNotifyStore } from './notify.ts';
import type { LoadState } from '@/composables/useLoad.ts';

export type { LoadState } from '@/composables/useLoad.ts';

export const useBuildingsStore = defineStore('buildings', () => {
  const notify = useNotifyStore();
  const levelsStore = useLevelsStore();
  const membersStore = useMembersStore();

  const list = ref<BuildingSummary[]>([]);
  const listState = ref<LoadState>('idle');
  const listError = ref('');

  const current = ref<Building | null>(null);
  const stacks = ref<StackSummary[]>([]);
  /** How opening the building went; `missing`: it does not exist or is not shared with this person. */
  const opening = useLoad({ canBeMissing: true });

  const role = computed<Role>(() => current.value?.role ?? 'viewer');
  const canEdit = computed(() => ROLE_RANK[role.value] >= ROLE_RANK.engineer);
  const isLead = computed(() => role.value === 'lead');

  const attempt = (context: string, work: () => Promise<unknown>, rollback?: () => void) =>
    attemptWith(notify, context, work, rollback);

  async function loadList(): Promise<void> {
    listState.value = 'loading';
    try {
      list.value = await buildingsApi.listBuildings();
      listState.value = 'ready';
    } catch (e) {
      listError.value = describeError(e);
      listState.value = 'error';
    }
  }

  async function createBuilding(body: CreateBuildingBody): Promise<Building | null> {
    let created: Building | null = null;
    await attempt('Could not create the building', async () => {
      created = await buildingsApi.createBuilding(body);
      list.value = [created, ...list.value];
    });
    return created;
  }

  async function open(id: number): Promise<void> {
    if (current.value?.id !== id) {
      current.value = null;
      levelsStore.replace(null, []);
      stacks.value = [];
    }
    membersStore.reset(id);
    await opening.run(async () => {
      const [building, buildingLevels, buildingStacks] = await Promise.all([
        buildingsApi.getBuilding(id),
        listLevels(id),
        stacksApi.listStacks(id),
      ]);
      current.value = building;
      levelsStore.replace(id, buildingLevels);
      stacks.value = buildingStacks;
    });
  }

  const buildingId = (): number => {
    if (!current.value) throw new Error('No building is open');
    return current.value.id;
  };

  async function saveOptions(options: AnalysisOptions): Promise<boolean> {
    return attempt('Could not save the analysis options', async () => {
      current.value = await buildingsApi.updateBuilding(buildingId(), { options });
      stacks.value = await stacksApi.listStacks(buildingId());
    });
  }

  /** The stack of this building that already has a grid reference, read as a person reads it ("c/4 " is
   *  "C/4"), other than the one being renamed. Two stacks of one name could not be told apart in the
   *  stacks table, the load import or the package. */
  function stackNamed(name: string, exceptId?: number): StackSummary | undefined {
    const wanted = name.trim().toLowerCase();
    return stacks.value.find((s) => s.id !== exceptId && s.name.trim().toLowerCase() === wanted);
  }

  async function createStack(body: CreateStackBody): Promise<number | null> {
    let id: number | null = null;
    await attempt('Could not create the stack', async () => {
      id = (await stacksApi.createStack(buildingId(), body)).id;
      stacks.value = await stacksApi.listStacks(buildingId());
    });
    return id;
  }

  async function renameStack(stackId: number, name: string): Promise<boolean> {
    const taken = stackNamed(name, stackId);
    if (taken) {
      notify.error(new Error(`stack ${taken.name} is already in this building`), 'Could not rename the stack');
      return false;
    }
    const before = stacks.value;
    stacks.value = stacks.value.map((s) => (s.id === stackId ? { ...s, name } : s));
    return attempt(
      'Could not rename the stack',
      () => stacksApi.renameStack(stackId, { name }),
      () => (stacks.value = before),
    );
  }

  async function removeStack(stackId: number): Promise<boolean> {
    const before = stacks.value;
    stacks.value = stacks.value.filter((s) => s.id !== stackId);
    return attempt(
      'Could not delete the stack',
      () => stacksApi.removeStack(stackId),
      () => (stacks.value = before),
    );
  }

  async function refreshStacks(): Promise<void> {
    if (!current.value) return;
    await attempt('Could not refresh the stacks', async () => {
      stacks.value = await stacksApi.listStacks(buildingId());
    });
  }

  /** Stacks put on (or taken off) the grid: their lines and their names, which follow the lines. */
  function applyPlacements(placements: readonly Placement[]): void {
    const byId = new Map(placements.map((p) => [p.id, p]));
    stacks.value = stacks.value.map((s) => {
      const p = byId.get(s.id);
      return p ? { ...s, name: p.name, gridX: p.gridX, gridY: p.gridY, webAlong: p.webAlong } : s;
    });
  }

  /** A result pushed on the live channel replaces the stack's figures in the table. */
  function applyStackChange(change: BuildingStackChanged): void {
    if (change.buildingId !== current.value?.id) return;
    const known = stacks.value.some((s) => s.id === change.stackId);
    if (!known) {
      void attempt('Could not refresh the stacks', async () => {
        stacks.value = await stacksApi.listStacks(change.buildingId);
      });
      return;
    }
    stacks.value = stacks.value.map((s) =>
      s.id === change.stackId
        ? {
            ...s,
            version: change.version,
            utilisation: change.utilisation,
            governingLiftId: change.governingLiftId,
            governingLiftLabel: change.governingLiftLabel,
            governingSection: change.governingSection,
            status: change.status,
          }
        : s,
    );
  }

  return {
    list,
    listState,
    listError,
    loadList,
    createBuilding,
    current,
    stacks,
    opened: opening.outcome,
    role,
    canEdit,
    isLead,
    open,
    saveOptions,
    stackNamed,
    createStack,
    renameStack,
    removeStack,
    applyStackChange,
    refreshStacks,
    applyPlacements,
  };
});
