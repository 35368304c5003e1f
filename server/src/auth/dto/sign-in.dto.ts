import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import type { SignInRequest } from '@ladderwright/shared/api';

export class SignInDto implements SignInRequest {
  @ApiProperty({ example: 'engineer@northfold.test' })
  @IsString({ message: 'email must be a string' })
  @IsNotEmpty({ message: 'email is required' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ example: 'Northfold-demo-1' })
  @IsString({ message: 'password must be a string' })
  @IsNotEmpty({ message: 'password is required' })
  @MaxLength(200)
  password!: string;
}
