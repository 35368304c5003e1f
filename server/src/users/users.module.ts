import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailModule } from '../mail/mail.module';
import { NotificationSettingsController } from './notification-settings.controller';
import { PasswordHasherService } from './password-hasher.service';
import { PasswordResetLinkModel } from './password-reset-link.model';
import { UserModel } from './user.model';
import { UsersController } from './users.controller';
import { UsersService } from './users.service';

@Module({
  imports: [SequelizeModule.forFeature([UserModel, PasswordResetLinkModel]), MailModule],
  controllers: [UsersController, NotificationSettingsController],
  providers: [UsersService, PasswordHasherService],
  exports: [UsersService, PasswordHasherService],
})
export class UsersModule {}
