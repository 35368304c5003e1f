import { ApiProperty } from '@nestjs/swagger';
import { DESIGN_DOCUMENT_COMPONENT } from './design-schema-components';

/** Swagger property for a design document body field: the JSON Schema served in components. */
export const ApiDesignDocumentProperty = (
  description = 'A design document (schemaVersion 1, SI base units).',
): PropertyDecorator =>
  ApiProperty({ description, allOf: [{ $ref: `#/components/schemas/${DESIGN_DOCUMENT_COMPONENT}` }] });
