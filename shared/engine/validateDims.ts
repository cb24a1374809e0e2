import { sectionDimsSchema } from '../schema/stack.ts';
import { EngineError } from './errors.ts';
import type { SectionDims } from './sectionTypes.ts';
import { cornerRadii } from './hollowSectionProperties.ts';

const fmt = (n: number) => String(Math.round(n * 100) / 100);

/**
 * Checks that dimensions describe a real section: every value finite and positive (zod, the same
 * schema as the document) and the plates fit together. Throws EngineError 'invalid_input'.
 */
export function validateDims(input: unknown): SectionDims {
  const parsed = sectionDimsSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue && issue.path.length > 0 ? `${issue.path.join('.')}: ` : '';
    throw new EngineError(
      'invalid_input',
      `Section dimensions are not valid (${where}${issue?.message ?? 'unknown problem'}).`,
    );
  }
  const dims = parsed.data;
  const fail = (why: string): never => {
    throw new EngineError('invalid_input', `Section dimensions are not valid: ${why}.`);
  };
  if (dims.shape === 'I') {
    const { h, b, tw, tf } = dims;
    const r = dims.make === 'rolled' ? dims.r : 0;
    if (h - 2 * tf - 2 * r <= 0)
      fail(`the flanges and root radii (2×${fmt(tf)} + 2×${fmt(r)} mm) leave no web in a depth of ${fmt(h)} mm`);
    if (tw + 2 * r >= b)
      fail(`the web and root radii (${fmt(tw)} + 2×${fmt(r)} mm) are as wide as the flange (${fmt(b)} mm)`);
  } else if (dims.shape === 'RHS') {
    const { h, b, t } = dims;
    const { outer } = cornerRadii(dims);
    if (Math.min(h, b) <= 2 * outer)
      fail(`a wall ${fmt(t)} mm thick with its corner radii does not fit in ${fmt(Math.min(h, b))} mm`);
  } else if (dims.t * 2 >= dims.d) {
    fail(`a wall ${fmt(dims.t)} mm thick leaves no bore in a tube of ${fmt(dims.d)} mm diameter`);
  }
  return dims;
}
