import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsNotEmpty, IsString, MaxLength } from 'class-validator';
import type { SignOffNoteRequest } from '@ladderwright/shared/api';

/** Returning a revision needs a note saying what to change. */
export class ReturnRevisionDto implements SignOffNoteRequest {
  @ApiProperty({ example: 'C1 runs at 92 % of its rating; use the 3 kV part.' })
  @IsDefined({ message: 'note is required to return a revision' })
  @IsString({ message: 'note must be text' })
  @IsNotEmpty({ message: 'note is required to return a revision' })
  @MaxLength(2000, { message: 'note must be at most 2000 characters' })
  note!: string;
}
