// Worker-thread entry of server/offThread/pool.ts. Plain JavaScript because a worker thread starts
// without the TypeScript loader the server runs under: it registers tsx, then loads the tasks.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';
import { lowerPriority } from './lowerPriority.mjs';

// A pool may ask its threads to give way to the event loop (pool.ts).
if (typeof workerData?.nice === 'number') lowerPriority(workerData.nice);

register();
const tasks = await import('./tasks.ts');

export const renderPackage = tasks.renderPackage;
export const sizeWholeBuilding = tasks.sizeWholeBuilding;
export const analyseWholeBuilding = tasks.analyseWholeBuilding;
export const editLargeStack = tasks.editLargeStack;
