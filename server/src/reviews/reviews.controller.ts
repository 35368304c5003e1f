import { Body, Controller, Get, Param, Patch, Post, UseFilters } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, ReviewComment, SignOff } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { RevisionRef } from '../revisions/revision-ref.decorator';
import { CreateCommentDto } from './dto/create-comment.dto';
import { ReturnRevisionDto } from './dto/return-revision.dto';
import { SignOffNoteDto } from './dto/sign-off-note.dto';
import { SubmitRevisionDto } from './dto/submit-revision.dto';
import { UpdateCommentDto } from './dto/update-comment.dto';
import { GatesClosedFilter } from './gates-closed.filter';
import { ReviewCommentsService } from './review-comments.service';
import { SignOffCommand } from './sign-off-command.decorator';
import { SignOffService, type TransitionInput } from './sign-off.service';

@ApiTags('sign-off')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber')
@UseFilters(GatesClosedFilter)
export class ReviewsController {
  constructor(
    private readonly signOff: SignOffService,
    private readonly comments: ReviewCommentsService,
  ) {}

  @Get('sign-off')
  @ApiOkResponse({
    description: 'State, reviewers, approvals, history, gate reasons, overrides and the commands open to the caller.',
  })
  get(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
  ): Promise<SignOff> {
    return this.signOff.get(ref, user, membership);
  }

  @SignOffCommand('submit', 'revision.submit')
  submit(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: SubmitRevisionDto,
  ): Promise<SignOff> {
    return this.run({ command: 'submit', ref, membership, user, ...body });
  }

  @SignOffCommand('withdraw', 'revision.submit')
  withdraw(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run({ command: 'withdraw', ref, membership, user, ...withoutOverride(body) });
  }

  @SignOffCommand('approve', 'review.decide')
  approve(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run({ command: 'approve', ref, membership, user, ...body });
  }

  @SignOffCommand('return', 'review.decide')
  returnRevision(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: ReturnRevisionDto,
  ): Promise<SignOff> {
    return this.run({ command: 'return', ref, membership, user, note: body.note });
  }

  @SignOffCommand('release', 'revision.release')
  release(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: SignOffNoteDto,
  ): Promise<SignOff> {
    return this.run({ command: 'release', ref, membership, user, ...body });
  }

  @Get('comments')
  listComments(@RevisionRef() ref: RevisionRef): Promise<ReviewComment[]> {
    return this.comments.list(ref);
  }

  @Post('comments')
  @RequiresProjectAction('review.comment')
  createComment(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Body() body: CreateCommentDto,
  ): Promise<ReviewComment> {
    return this.comments.create(ref, body, user);
  }

  @Patch('comments/:commentId')
  @RequiresProjectAction('review.comment')
  updateComment(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Param('commentId') commentId: string,
    @Body() body: UpdateCommentDto,
  ): Promise<ReviewComment> {
    return this.comments.setResolved({ ref, commentId, isResolved: body.isResolved, user });
  }

  private run(input: TransitionInput): Promise<SignOff> {
    return this.signOff.transition(input);
  }
}

/** Withdraw is never gated: an override sent with it is ignored rather than recorded. */
function withoutOverride(body: SignOffNoteDto): { note?: string } {
  return body.note !== undefined ? { note: body.note } : {};
}
