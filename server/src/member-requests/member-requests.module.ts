import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailModule } from '../mail/mail.module';
import { ProjectMemberModel } from '../projects/project-member.model';
import { UserModel } from '../users/user.model';
import { MemberRequestModel } from './member-request.model';
import { MemberRequestsController } from './member-requests.controller';
import { MemberRequestsService } from './member-requests.service';

@Module({
  imports: [SequelizeModule.forFeature([MemberRequestModel, ProjectMemberModel, UserModel]), MailModule],
  controllers: [MemberRequestsController],
  providers: [MemberRequestsService],
})
export class MemberRequestsModule {}
