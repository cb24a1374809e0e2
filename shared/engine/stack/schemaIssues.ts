// Shape problems of a document (zod), reported against the node or connection they belong to.
import type { z } from 'zod';
import type { Issue } from '../../schema/results.ts';
import { stackDocumentSchema } from '../../schema/stack.ts';

function idAt(list: unknown, index: PropertyKey | undefined): string | undefined {
  if (!Array.isArray(list) || typeof index !== 'number') return undefined;
  const item: unknown = list[index];
  if (typeof item !== 'object' || item === null || !('id' in item)) return undefined;
  return typeof item.id === 'string' ? item.id : undefined;
}

function toIssue(doc: unknown, issue: z.core.$ZodIssue): Issue {
  const [list, index, ...rest] = issue.path;
  const field = rest
    .filter((p) => p !== 'data')
    .map(String)
    .join('.');
  const lists = typeof doc === 'object' && doc !== null ? (doc as Record<string, unknown>) : {};
  const where = field ? ` ${field}` : '';
  if (list === 'nodes') {
    const nodeId = idAt(lists.nodes, index);
    return { nodeId, message: `Node ${nodeId ?? `#${String(index)}`}${where}: ${issue.message}` };
  }
  if (list === 'edges') {
    const edgeId = idAt(lists.edges, index);
    return { edgeId, message: `Connection ${edgeId ?? `#${String(index)}`}${where}: ${issue.message}` };
  }
  return { message: `The document${where}: ${issue.message}` };
}

/** Problems with the document's shape and values; empty when it matches the schema. */
export function schemaIssues(doc: unknown): Issue[] {
  const parsed = stackDocumentSchema.safeParse(doc);
  return parsed.success ? [] : parsed.error.issues.map((issue) => toIssue(doc, issue));
}
