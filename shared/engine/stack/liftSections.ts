// The section of every lift, resolved once per analysis (catalogue, the building's own sections or dimensions).
import { isEngineError } from '../errors.ts';
import { sectionData } from '../sectionData.ts';
import type { Issue } from '../../schema/results.ts';
import type { LiftData, SectionDims } from '../../schema/stack.ts';

export interface LiftSection {
  designation: string;
  dims: SectionDims;
  /** kg/m */
  massPerMetre: number;
}

/** The lift's section, or the reason it cannot be used, in the engineer's words. */
export function resolveLiftSection(
  data: LiftData,
  liftName: string,
  liftId: string,
  sections: ReadonlyMap<string, SectionDims> | undefined,
): LiftSection | Issue {
  try {
    // Memoised by the member check per designation, so a stack of repeated sections resolves each once.
    const { designation, dims, props } = sectionData(data.section, sections);
    return { designation, dims, massPerMetre: props.massPerMetre };
  } catch (error) {
    if (!isEngineError(error)) throw error;
    return { nodeId: liftId, message: `Lift ${liftName}: ${error.message}` };
  }
}

export function isLiftSection(value: LiftSection | Issue): value is LiftSection {
  return 'dims' in value;
}
