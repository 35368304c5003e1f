import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { CapturedMailModel } from './captured-mail.model';
import { FakeSmtpService } from './fake-smtp.service';
import { MailQueueModel } from './mail-queue.model';
import { MailService } from './mail.service';
import { OutboxController } from './outbox.controller';

@Module({
  imports: [SequelizeModule.forFeature([MailQueueModel, CapturedMailModel])],
  controllers: [OutboxController],
  providers: [MailService, FakeSmtpService],
  exports: [MailService],
})
export class MailModule {}
