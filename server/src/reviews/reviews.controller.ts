import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, ReviewComment, SignOff } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { CreateCommentDto } from './dto/create-comment.dto';
import { ReturnRevisionDto } from './dto/return-revision.dto';
import { SignOffNoteDto } from './dto/sign-off-note.dto';
import { SubmitRevisionDto } from './dto/submit-revision.dto';
import { UpdateCommentDto } from './dto/update-comment.dto';
import { ReviewCommentsService } from './review-comments.service';
import { SignOffCommand } from './sign-off-command.decorator';
import { SignOffService, type UserCommand } from './sign-off.service';

@ApiTags('sign-off')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber')
export class ReviewsController {
  constructor(
    private readonly signOff: SignOffService,
    private readonly comments: ReviewCommentsService,
  ) {}

  @Get('sign-off')
  @ApiOkResponse({ description: 'State, reviewers, approvals, audit history and the commands open to the caller.' })
  get(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
  ): Promise<SignOff> {
    return this.signOff.get(membership.projectId, designId, revisionNumber, user, membership);
  }

  @SignOffCommand('submit', 'revision.submit')
  submit(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: SubmitRevisionDto,
  ): Promise<SignOff> {
    return this.run('submit', membership, user, designId, revisionNumber, body.note, body.reviewerIds);
  }

  @SignOffCommand('withdraw', 'revision.submit')
  withdraw(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run('withdraw', membership, user, designId, revisionNumber, body.note);
  }

  @SignOffCommand('approve', 'review.decide')
  approve(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run('approve', membership, user, designId, revisionNumber, body.note);
  }

  @SignOffCommand('return', 'review.decide')
  returnRevision(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: ReturnRevisionDto,
  ): Promise<SignOff> {
    return this.run('return', membership, user, designId, revisionNumber, body.note);
  }

  @SignOffCommand('release', 'revision.release')
  release(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run('release', membership, user, designId, revisionNumber, body.note);
  }

  @Get('comments')
  listComments(
    @ProjectMembership() membership: Membership,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
  ): Promise<ReviewComment[]> {
    return this.comments.list(membership.projectId, designId, revisionNumber);
  }

  @Post('comments')
  @RequiresProjectAction('review.comment')
  createComment(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Body() body: CreateCommentDto,
  ): Promise<ReviewComment> {
    return this.comments.create(membership.projectId, designId, revisionNumber, body, user);
  }

  @Patch('comments/:commentId')
  @RequiresProjectAction('review.comment')
  updateComment(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Param('commentId') commentId: string,
    @Body() body: UpdateCommentDto,
  ): Promise<ReviewComment> {
    return this.comments.setResolved(membership.projectId, designId, revisionNumber, commentId, body.isResolved, user);
  }

  private run(
    command: UserCommand,
    membership: Membership,
    user: SessionUser,
    designId: string,
    rawNumber: string,
    note?: string,
    reviewerIds?: string[],
  ): Promise<SignOff> {
    return this.signOff.transition({
      command,
      projectId: membership.projectId,
      designId,
      rawNumber,
      user,
      membership,
      ...(note !== undefined ? { note } : {}),
      ...(reviewerIds !== undefined ? { reviewerIds } : {}),
    });
  }
}
