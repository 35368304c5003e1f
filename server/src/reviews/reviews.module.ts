import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailModule } from '../mail/mail.module';
import { ProjectMemberModel } from '../projects/project-member.model';
import { RevisionModel } from '../revisions/revision.model';
import { RevisionsModule } from '../revisions/revisions.module';
import { InboxController } from './inbox.controller';
import { InboxService } from './inbox.service';
import { ReviewCommentModel } from './review-comment.model';
import { ReviewCommentsService } from './review-comments.service';
import { ReviewsController } from './reviews.controller';
import { RevisionReviewerModel } from './revision-reviewer.model';
import { RevisionTransitionModel } from './revision-transition.model';
import { SignOffService } from './sign-off.service';

@Module({
  imports: [
    SequelizeModule.forFeature([
      RevisionModel,
      ProjectMemberModel,
      RevisionReviewerModel,
      RevisionTransitionModel,
      ReviewCommentModel,
    ]),
    RevisionsModule,
    MailModule,
  ],
  controllers: [ReviewsController, InboxController],
  providers: [SignOffService, ReviewCommentsService, InboxService],
  exports: [SignOffService],
})
export class ReviewsModule {}
