// Buildings: the list, and the open building with its levels, stacks and members.
// Actions report failures through the notifier and answer whether they succeeded, so forms can stay open.
import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import {
  ROLE_RANK,
  type Building,
  type BuildingSummary,
  type Level,
  type LevelMovePreview,
  type Member,
  type Role,
  type StackSummary,
} from '@shared/schema/api.ts';
import type { AnalysisOptions } from '@shared/schema/results.ts';
import type { Placement } from '@shared/schema/building.ts';
import type { BuildingStackChanged } from '@shared/schema/socket.ts';
import {
  buildingsApi,
  levelsApi,
  membersApi,
  type CreateBuildingBody,
  type CreateLevelBody,
  type UpdateLevelBody,
} from '@/api/buildings.ts';
import { stacksApi, type CreateStackBody } from '@/api/stacks.ts';
import { describeError, isNotFound, useNotifyStore } from './notify.ts';

export type LoadState = 'idle' | 'loading' | 'ready' | 'error';

/** The path key of a member: the user id, or the e-mail address while the invitation is pending. */
export const memberKey = (m: Member): string | number => m.userId ?? m.email;

const byElevation = (a: Level, b: Level) => a.elevation - b.elevation;

export const useBuildingsStore = defineStore('buildings', () => {
  const notify = useNotifyStore();

  const list = ref<BuildingSummary[]>([]);
  const listState = ref<LoadState>('idle');
  const listError = ref('');

  const current = ref<Building | null>(null);
  const levels = ref<Level[]>([]);
  const stacks = ref<StackSummary[]>([]);
  const members = ref<Member[]>([]);
  const pageState = ref<LoadState>('idle');
  const pageError = ref('');
  /** The open building does not exist or is not shared with this person. */
  const pageMissing = ref(false);
  const membersState = ref<LoadState>('idle');

  const role = computed<Role>(() => current.value?.role ?? 'viewer');
  const canEdit = computed(() => ROLE_RANK[role.value] >= ROLE_RANK.engineer);
  const isLead = computed(() => role.value === 'lead');

  async function attempt(context: string, work: () => Promise<void>, rollback?: () => void): Promise<boolean> {
    try {
      await work();
      return true;
    } catch (e) {
      rollback?.();
      notify.error(e, context);
      return false;
    }
  }

  async function loadList(): Promise<void> {
    listState.value = 'loading';
    try {
      list.value = await buildingsApi.list();
      listState.value = 'ready';
    } catch (e) {
      listError.value = describeError(e);
      listState.value = 'error';
    }
  }

  async function createBuilding(body: CreateBuildingBody): Promise<Building | null> {
    let created: Building | null = null;
    await attempt('Could not create the building', async () => {
      created = await buildingsApi.create(body);
      list.value = [created, ...list.value];
    });
    return created;
  }

  async function open(id: number): Promise<void> {
    if (current.value?.id !== id) {
      current.value = null;
      levels.value = [];
      stacks.value = [];
      members.value = [];
      membersState.value = 'idle';
    }
    pageState.value = 'loading';
    try {
      const [building, buildingLevels, buildingStacks] = await Promise.all([
        buildingsApi.get(id),
        levelsApi.list(id),
        stacksApi.list(id),
      ]);
      current.value = building;
      levels.value = [...buildingLevels].sort(byElevation);
      stacks.value = buildingStacks;
      pageState.value = 'ready';
    } catch (e) {
      pageError.value = describeError(e);
      pageMissing.value = isNotFound(e);
      pageState.value = 'error';
    }
  }

  const buildingId = (): number => {
    if (!current.value) throw new Error('No building is open');
    return current.value.id;
  };

  async function saveOptions(options: AnalysisOptions): Promise<boolean> {
    return attempt('Could not save the analysis options', async () => {
      current.value = await buildingsApi.update(buildingId(), { options });
      stacks.value = await stacksApi.list(buildingId());
    });
  }

  async function addLevel(body: CreateLevelBody): Promise<boolean> {
    return attempt('Could not add the level', async () => {
      const level = await levelsApi.create(buildingId(), body);
      levels.value = [...levels.value, level].sort(byElevation);
    });
  }

  async function updateLevel(levelId: string, body: UpdateLevelBody): Promise<boolean> {
    const before = levels.value;
    levels.value = levels.value.map((l) => (l.id === levelId ? { ...l, ...body } : l)).sort(byElevation);
    return attempt(
      'Could not change the level',
      async () => {
        const saved = await levelsApi.update(buildingId(), levelId, body);
        levels.value = levels.value.map((l) => (l.id === levelId ? saved : l)).sort(byElevation);
      },
      () => (levels.value = before),
    );
  }

  /** What moving a level would do to the stacks, or null (reported) when it cannot be worked out. */
  async function previewLevelMove(levelId: string, elevation: number): Promise<LevelMovePreview | null> {
    let preview: LevelMovePreview | null = null;
    await attempt('Could not work out what the move changes', async () => {
      preview = await levelsApi.previewMove(buildingId(), levelId, elevation);
    });
    return preview;
  }

  async function removeLevel(levelId: string): Promise<boolean> {
    const before = levels.value;
    levels.value = levels.value.filter((l) => l.id !== levelId);
    return attempt(
      'Could not delete the level',
      () => levelsApi.remove(buildingId(), levelId),
      () => (levels.value = before),
    );
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
      id = (await stacksApi.create(buildingId(), body)).id;
      stacks.value = await stacksApi.list(buildingId());
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
      () => stacksApi.rename(stackId, { name }).then(() => undefined),
      () => (stacks.value = before),
    );
  }

  async function removeStack(stackId: number): Promise<boolean> {
    const before = stacks.value;
    stacks.value = stacks.value.filter((s) => s.id !== stackId);
    return attempt(
      'Could not delete the stack',
      () => stacksApi.remove(stackId),
      () => (stacks.value = before),
    );
  }

  async function refreshStacks(): Promise<void> {
    if (!current.value) return;
    await attempt('Could not refresh the stacks', async () => {
      stacks.value = await stacksApi.list(buildingId());
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
        stacks.value = await stacksApi.list(change.buildingId);
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

  async function loadMembers(): Promise<void> {
    membersState.value = 'loading';
    const ok = await attempt('Could not load the members', async () => {
      members.value = await membersApi.list(buildingId());
    });
    membersState.value = ok ? 'ready' : 'error';
  }

  async function addMember(email: string, memberRole: Role): Promise<boolean> {
    return attempt('Could not add the member', async () => {
      await membersApi.add(buildingId(), { email, role: memberRole });
      members.value = await membersApi.list(buildingId());
    });
  }

  async function changeMemberRole(member: Member, memberRole: Role): Promise<boolean> {
    const before = members.value;
    members.value = members.value.map((m) => (memberKey(m) === memberKey(member) ? { ...m, role: memberRole } : m));
    return attempt(
      'Could not change the role',
      () => membersApi.update(buildingId(), memberKey(member), { role: memberRole }).then(() => undefined),
      () => (members.value = before),
    );
  }

  async function removeMember(member: Member): Promise<boolean> {
    const before = members.value;
    members.value = members.value.filter((m) => memberKey(m) !== memberKey(member));
    return attempt(
      'Could not remove the member',
      () => membersApi.remove(buildingId(), memberKey(member)),
      () => (members.value = before),
    );
  }

  return {
    list,
    listState,
    listError,
    loadList,
    createBuilding,
    current,
    levels,
    stacks,
    members,
    pageState,
    pageError,
    pageMissing,
    membersState,
    role,
    canEdit,
    isLead,
    open,
    saveOptions,
    addLevel,
    updateLevel,
    previewLevelMove,
    removeLevel,
    stackNamed,
    createStack,
    renameStack,
    removeStack,
    applyStackChange,
    refreshStacks,
    applyPlacements,
    loadMembers,
    addMember,
    changeMemberRole,
    removeMember,
  };
});
