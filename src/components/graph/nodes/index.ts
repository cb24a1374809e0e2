// One component per node kind, keyed by the kind so Vue Flow draws each node with its own component.
import { markRaw, type Component } from 'vue';
import type { NodeKind } from '@shared/schema/stack.ts';
import CapNode from './CapNode.vue';
import LevelLine from './LevelLine.vue';
import LiftNode from './LiftNode.vue';
import LoadNode from './LoadNode.vue';
import RestraintNode from './RestraintNode.vue';
import SpliceNode from './SpliceNode.vue';
import SupportNode from './SupportNode.vue';

export const nodeTypes: Record<NodeKind | 'level', Component> = {
  level: markRaw(LevelLine),
  support: markRaw(SupportNode),
  lift: markRaw(LiftNode),
  splice: markRaw(SpliceNode),
  restraint: markRaw(RestraintNode),
  cap: markRaw(CapNode),
  load: markRaw(LoadNode),
};
