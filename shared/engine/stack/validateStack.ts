import type { StackValidation } from '../../schema/results.ts';
import type { StackDocument } from '../../schema/stack.ts';
import type { AnalysisContext } from './context.ts';
import { inspectStack } from './inspectStack.ts';

/** Every problem of a stack document, not only the first; warnings accompany valid ones (docs/contracts.md). */
export function validateStack(doc: StackDocument, context: AnalysisContext = {}): StackValidation {
  const { errors, warnings } = inspectStack(doc, context);
  return { errors, warnings };
}
