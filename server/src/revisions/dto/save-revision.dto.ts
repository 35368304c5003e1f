import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsInt, IsObject, IsString, MaxLength, Min } from 'class-validator';
import type { SaveRevisionRequest } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { ShallowTransform } from '../../common/decorators/shallow-transform.decorator';
import { ApiDesignDocumentProperty } from '../../analysis/api-design-document.decorator';

@ShallowTransform()
export class SaveRevisionDto implements SaveRevisionRequest {
  @ApiProperty({ example: 1, description: 'The revision the edit started from; must be the latest.' })
  @IsDefined({ message: 'baseRevisionNumber is required' })
  @IsInt({ message: 'baseRevisionNumber must be an integer' })
  @Min(1, { message: 'baseRevisionNumber must be 1 or more' })
  baseRevisionNumber!: number;

  @ApiDesignDocumentProperty()
  @IsDefined({ message: 'document is required' })
  @IsObject({ message: 'document must be a design document object' })
  document!: Design;

  @ApiProperty({ example: 'Raised C2 to 22 nF for lower ripple' })
  @IsDefined({ message: 'changeNote is required' })
  @IsString({ message: 'changeNote must be text' })
  @MaxLength(2000, { message: 'changeNote must be at most 2000 characters' })
  changeNote!: string;
}
