import type { DesignSource } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { DomainError } from '@ladderwright/shared/errors';

/** How each kind of source is turned into a document; supplied by the service. */
export interface DesignSourceResolvers {
  blank: () => Design;
  template: (templateId: string) => Design | null;
  revision: (designId: string, revisionNumber: number | undefined) => Promise<Design>;
  parse: (document: unknown) => Design;
}

const KINDS: readonly DesignSource['kind'][] = ['blank', 'template', 'duplicate', 'document'];

function invalid(field: string, message: string): DomainError {
  return new DomainError('invalid_argument', message, field);
}

/**
 * The document for revision 1 of a new design, from the untrusted `from` of the request. Every refusal
 * names its field under `from` (e.g. `from.templateId`).
 */
export async function designSourceDocument(from: unknown, resolvers: DesignSourceResolvers): Promise<Design> {
  const source = (typeof from === 'object' && from !== null ? from : {}) as Record<string, unknown>;
  switch (source.kind) {
    case 'blank':
      return resolvers.blank();
    case 'template': {
      if (typeof source.templateId !== 'string')
        throw invalid('from.templateId', 'from.templateId must be a template id');
      const document = resolvers.template(source.templateId);
      if (!document) throw invalid('from.templateId', `from.templateId '${source.templateId}' is not a known template`);
      return document;
    }
    case 'duplicate': {
      if (typeof source.designId !== 'string') throw invalid('from.designId', 'from.designId must be a design id');
      const number = source.revisionNumber;
      if (number !== undefined && !(typeof number === 'number' && Number.isInteger(number) && number >= 1)) {
        throw invalid('from.revisionNumber', 'from.revisionNumber must be a revision number (an integer ≥ 1)');
      }
      return structuredClone(await resolvers.revision(source.designId, number));
    }
    case 'document':
      if (source.document === undefined) throw invalid('from.document', 'from.document is required');
      return resolvers.parse(source.document);
    default:
      throw invalid('from.kind', `from.kind must be one of ${KINDS.join(', ')}`);
  }
}
