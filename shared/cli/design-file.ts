import { readFileSync, statSync } from 'node:fs';
import type { Design } from '../src/designs/design.types';
import { designLimits } from '../src/designs/design-limits';
import { withoutRetiredFields } from '../src/designs/retired-fields';
import { validateDesign } from '../src/designs/validate-design';
import { DomainError } from '../src/errors';

/**
 * A design document from a JSON file, validated with the limits of the domain. A file far larger than
 * any document can be (four times the document limit, for indentation) is refused before it is read.
 */
export function readDesignFile(path: string): Design {
  let text: string;
  try {
    const maxFileBytes = 4 * designLimits.maxDocumentBytes;
    if (statSync(path).size > maxFileBytes) {
      throw new DomainError('invalid_design', `${path} is larger than ${maxFileBytes} bytes`, 'DESIGN.json');
    }
    text = readFileSync(path, 'utf8');
  } catch (error) {
    if (error instanceof DomainError) throw error;
    throw new DomainError('invalid_design', `cannot read ${path}: ${(error as Error).message}`, 'DESIGN.json');
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch (error) {
    throw new DomainError('invalid_design', `cannot read ${path} as JSON: ${(error as Error).message}`, 'DESIGN.json');
  }
  return validateDesign(withoutRetiredFields(parsed));
}
