// The open building's model (docs/building-model.md): grid, build-ups, floor loads and areas set by hand.
// Writes go to the server, which re-analyses the stacks they affect; the reply (or the live channel) is the truth.
import { ref } from 'vue';
import { defineStore } from 'pinia';
import {
  EMPTY_MODEL,
  type AreaOverride,
  type Buildup,
  type BuildingModel,
  type BuildingModelChanged,
  type BuildingModelReply,
  type Grid,
  type StackPlacement,
} from '@shared/schema/building.ts';
import * as buildingModelApi from '@/api/buildingModel.ts';
import type { FloorLoadBody } from '@/api/buildingModel.ts';
import { useBuildingsStore } from './buildings.ts';
import { useNotifyStore } from './notify.ts';

export const useBuildingModelStore = defineStore('buildingModel', () => {
  const notify = useNotifyStore();
  const buildings = useBuildingsStore();

  const buildingId = ref<number | null>(null);
  const model = ref<BuildingModel>(EMPTY_MODEL);
  const version = ref(0);

  function take(reply: BuildingModelReply): void {
    const { version: v, ...rest } = reply;
    // A late reply must not undo a newer model heard on the live channel.
    if (v < version.value) return;
    model.value = rest;
    version.value = v;
  }

  async function load(id: number): Promise<void> {
    if (buildingId.value !== id) {
      model.value = EMPTY_MODEL;
      version.value = 0;
    }
    buildingId.value = id;
    try {
      take(await buildingModelApi.getModel(id));
    } catch (e) {
      notify.error(e, 'Could not load the grid and floor loads');
    }
  }

  async function write(
    context: string,
    work: (id: number) => Promise<BuildingModelReply>,
    done?: string,
  ): Promise<boolean> {
    if (buildingId.value === null) return false;
    try {
      take(await work(buildingId.value));
      if (done) notify.success(done);
      return true;
    } catch (e) {
      notify.error(e, context);
      return false;
    }
  }

  const saveGrid = (grid: Grid) =>
    write(
      'Could not save the grid',
      async (id) => {
        const reply = await buildingModelApi.putGrid(id, grid);
        // Renamed grid lines rename the stacks on them
        await buildings.refreshStacks();
        return reply;
      },
      'Grid saved',
    );
  const saveBuildups = (buildups: Buildup[]) =>
    write('Could not save the build-ups', (id) => buildingModelApi.putBuildups(id, buildups), 'Build-ups saved');
  const saveFloorLoad = (levelId: string, body: FloorLoadBody) =>
    write('Could not save the floor load', (id) => buildingModelApi.putFloorLoad(id, levelId, body));
  const saveAreaOverrides = (stackId: number, overrides: AreaOverride[]) =>
    write('Could not save the areas set by hand', () => buildingModelApi.putAreaOverrides(stackId, overrides));

  async function place(stackId: number, placement: StackPlacement): Promise<boolean> {
    try {
      const placed = await buildingModelApi.placeStack(stackId, placement);
      buildings.applyPlacements([placed]);
      return true;
    } catch (e) {
      notify.error(e, 'Could not place the stack');
      return false;
    }
  }

  function applyModelChange(change: BuildingModelChanged): void {
    if (change.buildingId !== buildingId.value) return;
    if (change.version >= version.value) {
      model.value = change.model;
      version.value = change.version;
    }
    if (change.placements) buildings.applyPlacements(change.placements);
  }

  return {
    buildingId,
    model,
    version,
    load,
    saveGrid,
    saveBuildups,
    saveFloorLoad,
    saveAreaOverrides,
    place,
    applyModelChange,
  };
});
