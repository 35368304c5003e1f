import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsDefined } from 'class-validator';
import type { NotificationSettings } from '@ladderwright/shared/api';

/** Every mail kind must be given (a full replacement), so a typo cannot silently leave a kind unchanged. */
export class UpdateNotificationSettingsDto implements NotificationSettings {
  @ApiProperty()
  @IsDefined({ message: 'sign-off.submit is required' })
  @IsBoolean({ message: 'sign-off.submit must be true or false' })
  'sign-off.submit': boolean;

  @ApiProperty()
  @IsDefined({ message: 'sign-off.withdraw is required' })
  @IsBoolean({ message: 'sign-off.withdraw must be true or false' })
  'sign-off.withdraw': boolean;

  @ApiProperty()
  @IsDefined({ message: 'sign-off.approve is required' })
  @IsBoolean({ message: 'sign-off.approve must be true or false' })
  'sign-off.approve': boolean;

  @ApiProperty()
  @IsDefined({ message: 'sign-off.return is required' })
  @IsBoolean({ message: 'sign-off.return must be true or false' })
  'sign-off.return': boolean;

  @ApiProperty()
  @IsDefined({ message: 'sign-off.release is required' })
  @IsBoolean({ message: 'sign-off.release must be true or false' })
  'sign-off.release': boolean;

  @ApiProperty()
  @IsDefined({ message: 'sign-off.comment is required' })
  @IsBoolean({ message: 'sign-off.comment must be true or false' })
  'sign-off.comment': boolean;

  @ApiProperty()
  @IsDefined({ message: 'members.request-decided is required' })
  @IsBoolean({ message: 'members.request-decided must be true or false' })
  'members.request-decided': boolean;
}
