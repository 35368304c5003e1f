import { IsDefined, IsObject } from 'class-validator';
import type { EvaluateRequest } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { ShallowTransform } from '../../common/decorators/shallow-transform.decorator';
import { ApiDesignDocumentProperty } from '../api-design-document.decorator';

@ShallowTransform()
export class EvaluateDesignDto implements EvaluateRequest {
  @ApiDesignDocumentProperty('The unsaved design document to analyse.')
  @IsDefined({ message: 'document is required' })
  @IsObject({ message: 'document must be a design document object' })
  document!: Design;
}
