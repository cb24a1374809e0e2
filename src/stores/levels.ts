// The open building's levels, lowest first: added, renamed, moved (with a preview of what moving does to the
// stacks) and deleted, optimistically where the answer is predictable. The buildings store fills the list on
// opening a building.
import { ref } from 'vue';
import { defineStore } from 'pinia';
import type { CreateLevelBody, Level, LevelMovePreview, UpdateLevelBody } from '@shared/schema/api.ts';
import * as levelsApi from '@/api/levels.ts';
import { useNotifyStore } from './notify.ts';
import { attempt } from './attempt.ts';

const byElevation = (a: Level, b: Level) => a.elevation - b.elevation;

export const useLevelsStore = defineStore('levels', () => {
  const notify = useNotifyStore();
  const buildingId = ref<number | null>(null);
  const levels = ref<Level[]>([]);

  /** The levels of the building just opened (any order). */
  function replace(forBuilding: number | null, list: readonly Level[]): void {
    buildingId.value = forBuilding;
    levels.value = [...list].sort(byElevation);
  }

  const building = (): number => {
    if (buildingId.value === null) throw new Error('No building is open');
    return buildingId.value;
  };

  async function add(body: CreateLevelBody): Promise<boolean> {
    return attempt(notify, 'Could not add the level', async () => {
      const level = await levelsApi.createLevel(building(), body);
      levels.value = [...levels.value, level].sort(byElevation);
    });
  }

  async function update(levelId: string, body: UpdateLevelBody): Promise<boolean> {
    const before = levels.value;
    levels.value = levels.value.map((l) => (l.id === levelId ? { ...l, ...body } : l)).sort(byElevation);
    return attempt(
      notify,
      'Could not change the level',
      async () => {
        const saved = await levelsApi.updateLevel(building(), levelId, body);
        levels.value = levels.value.map((l) => (l.id === levelId ? saved : l)).sort(byElevation);
      },
      () => (levels.value = before),
    );
  }

  /** What moving a level would do to the stacks, or null (reported) when it cannot be worked out. */
  async function previewMove(levelId: string, elevation: number): Promise<LevelMovePreview | null> {
    let preview: LevelMovePreview | null = null;
    await attempt(notify, 'Could not work out what the move changes', async () => {
      preview = await levelsApi.previewLevelMove(building(), levelId, elevation);
    });
    return preview;
  }

  async function remove(levelId: string): Promise<boolean> {
    const before = levels.value;
    levels.value = levels.value.filter((l) => l.id !== levelId);
    return attempt(
      notify,
      'Could not delete the level',
      () => levelsApi.removeLevel(building(), levelId),
      () => (levels.value = before),
    );
  }

  return { levels, replace, add, update, previewMove, remove };
});
