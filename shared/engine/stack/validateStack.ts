import type { StackValidation } from '../../schema/results.ts';
import type { StackDocument } from '../../schema/stack.ts';
import type { AnalysisContext } from './context.ts';
import { inspectStack } from './inspectStack.ts';

/** Every problem of a stack document (SPEC §4), not only the first; warnings accompany valid ones. */
export function validateStack(doc: StackDocument, context: AnalysisContext = {}): StackValidation {
  const { errors, warnings } = inspectStack(doc, context);
  return { errors, warnings };
}
