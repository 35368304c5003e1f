import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, MemberRequest } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { CreateMemberRequestDto } from './dto/create-member-request.dto';
import { DeclineMemberRequestDto } from './dto/decline-member-request.dto';
import { MemberRequestsService } from './member-requests.service';

@ApiTags('projects')
@ApiCookieAuth()
@Controller('projects/:projectId/member-requests')
export class MemberRequestsController {
  constructor(private readonly requests: MemberRequestsService) {}

  /** A lead: every pending request and the latest decided; anyone else: their own requests. */
  @Get()
  list(@ProjectMembership() membership: Membership, @CurrentUser() user: SessionUser): Promise<MemberRequest[]> {
    return this.requests.list(membership, user);
  }

  @Post()
  @RequiresProjectAction('members.request')
  create(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Body() body: CreateMemberRequestDto,
  ): Promise<MemberRequest> {
    return this.requests.create(membership.projectId, body, actor);
  }

  @Post(':requestId/accept')
  @HttpCode(200)
  @RequiresProjectAction('members.manage')
  accept(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Param('requestId') requestId: string,
  ): Promise<MemberRequest> {
    return this.requests.accept(membership.projectId, requestId, actor);
  }

  @Post(':requestId/decline')
  @HttpCode(200)
  @RequiresProjectAction('members.manage')
  decline(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Param('requestId') requestId: string,
    @Body() body: DeclineMemberRequestDto,
  ): Promise<MemberRequest> {
    return this.requests.decline(membership.projectId, requestId, body.reason, actor);
  }
}
