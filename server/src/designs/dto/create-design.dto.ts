import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsObject, IsString, MaxLength, MinLength } from 'class-validator';
import type { CreateDesignRequest, DesignSource } from '@ladderwright/shared/api';
import { IsNotBlank } from '../../common/decorators/is-not-blank.decorator';

export class CreateDesignDto implements CreateDesignRequest {
  @ApiProperty({ example: 'Ionizer bar, 7-cell variant' })
  @IsDefined({ message: 'name is required' })
  @IsString({ message: 'name must be text' })
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(200, { message: 'name must be at most 200 characters' })
  @IsNotBlank()
  name!: string;

  @ApiProperty({
    description:
      "Where revision 1 comes from: {kind:'blank'} | {kind:'template', templateId} | " +
      "{kind:'duplicate', designId, revisionNumber?} | {kind:'document', document}",
    example: { kind: 'template', templateId: 'detectorBias' },
    type: 'object',
    additionalProperties: true,
  })
  @IsDefined({ message: 'from is required' })
  @IsObject({ message: 'from must be an object with a kind' })
  from!: DesignSource;
}
