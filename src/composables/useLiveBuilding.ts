// The building the route names, opened with its model and kept live while the page is open: stack
// results and model changes arrive on the building's channel (src/api/buildingLive.ts).
import { computed, onBeforeUnmount, watch } from 'vue';
import { useRoute } from 'vue-router';
import type { BuildingRevisionChanged, BuildingStackChanged } from '@shared/schema/socket.ts';
import { watchBuilding, type BuildingWatch } from '@/api/buildingLive.ts';
import { useAuthStore } from '@/stores/auth.ts';
import { useBuildingModelStore } from '@/stores/buildingModel.ts';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { useNotifyStore } from '@/stores/notify.ts';

export interface LiveBuildingExtras {
  /** More to load beside the building and its model (e.g. the positions of typical columns). */
  load?: (buildingId: number) => Promise<void>;
  /** More to do with each stack change heard on the building's channel. */
  onStackChange?: (change: BuildingStackChanged) => void;
  /** A revision of the building was frozen, checked, commented on or approved (docs/issue-workflow.md). */
  onRevisionChange?: (change: BuildingRevisionChanged) => void;
}

export function useLiveBuilding(extras: LiveBuildingExtras = {}) {
  const route = useRoute();
  const buildings = useBuildingsStore();
  const model = useBuildingModelStore();
  const auth = useAuthStore();
  const notify = useNotifyStore();

  const id = computed(() => Number(route.params.id));
  /** The open building, once it is the one the route names. */
  const building = computed(() => (buildings.current?.id === id.value ? buildings.current : null));

  let live: BuildingWatch | null = null;

  async function load(): Promise<void> {
    await Promise.all([buildings.open(id.value), model.load(id.value), extras.load?.(id.value)]);
  }

  watch(
    id,
    async () => {
      live?.stop();
      await load();
      live =
        auth.token && buildings.current
          ? watchBuilding(
              auth.token,
              id.value,
              (change) => {
                buildings.applyStackChange(change);
                extras.onStackChange?.(change);
              },
              (m) => notify.info(m),
              model.applyModelChange,
              extras.onRevisionChange,
            )
          : null;
    },
    { immediate: true },
  );
  onBeforeUnmount(() => live?.stop());

  return { id, building, load };
}
