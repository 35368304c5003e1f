import type { OpenAPIObject } from '@nestjs/swagger';
import { designDocumentSchema } from '@ladderwright/shared/designs';

export const DESIGN_DOCUMENT_COMPONENT = 'DesignDocument';

type SchemaNode = unknown;

function rewriteRefs(node: SchemaNode): SchemaNode {
  if (Array.isArray(node)) return node.map(rewriteRefs);
  if (typeof node !== 'object' || node === null) return node;
  return Object.fromEntries(
    Object.entries(node).map(([key, value]) =>
      key === '$ref' && typeof value === 'string' && value.startsWith('#/$defs/')
        ? [key, `#/components/schemas/${DESIGN_DOCUMENT_COMPONENT}_${value.slice('#/$defs/'.length)}`]
        : [key, rewriteRefs(value)],
    ),
  );
}

/**
 * Adds the design document JSON Schema to an OpenAPI document as `components.schemas.DesignDocument`,
 * its `$defs` hoisted to `DesignDocument_<name>` (OpenAPI resolves `$ref` from the document root).
 */
export function withDesignSchemaComponents(document: OpenAPIObject): OpenAPIObject {
  const {
    $defs,
    $schema: _dialect,
    $id: _id,
    ...root
  } = designDocumentSchema as Record<string, unknown> & {
    $defs?: Record<string, unknown>;
  };
  const hoisted = Object.fromEntries(
    Object.entries($defs ?? {}).map(([name, schema]) => [`${DESIGN_DOCUMENT_COMPONENT}_${name}`, rewriteRefs(schema)]),
  );
  const components = document.components ?? {};
  return {
    ...document,
    components: {
      ...components,
      schemas: { ...components.schemas, ...hoisted, [DESIGN_DOCUMENT_COMPONENT]: rewriteRefs(root) } as NonNullable<
        typeof components.schemas
      >,
    },
  };
}
