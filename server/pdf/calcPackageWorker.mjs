// Worker-thread entry of server/pdf/packageRenderer.ts. Plain JavaScript because a worker thread starts
// without the TypeScript loader the server runs under: it registers tsx, then loads the renderer.
import { register } from 'tsx/esm/api';

register();
const { renderCalcPackage } = await import('./calcPackage.ts');

/** @param {{ snapshot: import('../../shared/schema/revisions.ts').RevisionSnapshot; hash: string }} job */
export default function render({ snapshot, hash }) {
  return renderCalcPackage(snapshot, hash);
}
