// Worker-thread entry of server/offThread/pool.ts. Plain JavaScript because a worker thread starts
// without the TypeScript loader the server runs under: it registers tsx, then loads the tasks.
import { register } from 'tsx/esm/api';

register();
const tasks = await import('./tasks.ts');

export const renderPackage = tasks.renderPackage;
export const sizeWholeBuilding = tasks.sizeWholeBuilding;
export const editLargeStack = tasks.editLargeStack;
