import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type {
  CurrentUser as SessionUser,
  ProjectDetail,
  ProjectMember,
  ProjectSummary,
} from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresAppAction, RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { AddMemberDto } from './dto/add-member.dto';
import { ChangeMemberRoleDto } from './dto/change-member-role.dto';
import { CreateProjectDto } from './dto/create-project.dto';
import { UpdateProjectDto } from './dto/update-project.dto';
import { ProjectsService } from './projects.service';
import { AllowedWhenArchived } from '../common/decorators/allowed-when-archived.decorator';

@ApiTags('projects')
@ApiCookieAuth()
@Controller('projects')
export class ProjectsController {
  constructor(private readonly projects: ProjectsService) {}

  @Get()
  list(@CurrentUser() user: SessionUser): Promise<ProjectSummary[]> {
    return this.projects.listForUser(user.id);
  }

  @Post()
  @RequiresAppAction('projects.create')
  create(@CurrentUser() user: SessionUser, @Body() body: CreateProjectDto): Promise<ProjectSummary> {
    return this.projects.create(body, user.id);
  }

  @Get(':projectId')
  detail(@ProjectMembership() membership: Membership): Promise<ProjectDetail> {
    return this.projects.detail(membership.projectId, membership.role);
  }

  @Patch(':projectId')
  @RequiresProjectAction('members.manage')
  update(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Body() body: UpdateProjectDto,
  ): Promise<ProjectDetail> {
    return this.projects.update(membership.projectId, body, actor);
  }

  @Post(':projectId/archive')
  @HttpCode(204)
  @RequiresProjectAction('members.manage')
  async archive(@ProjectMembership() membership: Membership, @CurrentUser() actor: SessionUser): Promise<void> {
    await this.projects.archive(membership.projectId, actor);
  }

  @Post(':projectId/unarchive')
  @HttpCode(204)
  @RequiresProjectAction('members.manage')
  @AllowedWhenArchived()
  async unarchive(@ProjectMembership() membership: Membership, @CurrentUser() actor: SessionUser): Promise<void> {
    await this.projects.unarchive(membership.projectId, actor);
  }

  @Get(':projectId/members')
  members(@ProjectMembership() membership: Membership): Promise<ProjectMember[]> {
    return this.projects.listMembers(membership.projectId);
  }

  @Post(':projectId/members')
  @RequiresProjectAction('members.manage')
  addMember(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Body() body: AddMemberDto,
  ): Promise<ProjectMember> {
    return this.projects.addMember(membership.projectId, body, actor);
  }

  @Patch(':projectId/members/:userId')
  @RequiresProjectAction('members.manage')
  changeMemberRole(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Param('userId') userId: string,
    @Body() body: ChangeMemberRoleDto,
  ): Promise<ProjectMember> {
    return this.projects.changeMemberRole(membership.projectId, userId, body, actor);
  }

  @Delete(':projectId/members/:userId')
  @HttpCode(204)
  @RequiresProjectAction('members.manage')
  async removeMember(
    @ProjectMembership() membership: Membership,
    @CurrentUser() actor: SessionUser,
    @Param('userId') userId: string,
  ): Promise<void> {
    await this.projects.removeMember(membership.projectId, userId, actor);
  }
}
