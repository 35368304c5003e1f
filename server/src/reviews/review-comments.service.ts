import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CreateCommentRequest, CurrentUser, ReviewComment } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { isUuid } from '../common/uuid';
import { MailService } from '../mail/mail.service';
import { ProjectMemberModel } from '../projects/project-member.model';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { UserModel } from '../users/user.model';
import { hasPath } from './document-path';
import { ReviewCommentModel } from './review-comment.model';
import { RevisionReviewerModel } from './revision-reviewer.model';
import { commentMail } from './sign-off-mail';
import { SignOffService } from './sign-off.service';

function toComment(row: ReviewCommentModel, replies: ReviewComment[]): ReviewComment {
  return {
    id: row.id,
    parentId: row.parentId,
    authorId: row.authorId,
    authorName: row.author?.displayName ?? '',
    body: row.body,
    anchor: row.anchorKind && row.anchorPath ? { kind: row.anchorKind, path: row.anchorPath } : null,
    isResolved: row.resolvedAt !== null,
    resolvedByName: row.resolvedBy?.displayName ?? null,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    replies,
  };
}

/** Review comments: threads one level deep, optionally anchored to an input field or a result key; resolvable. */
@Injectable()
export class ReviewCommentsService {
  constructor(
    @InjectModel(ReviewCommentModel) private readonly comments: typeof ReviewCommentModel,
    @InjectModel(RevisionReviewerModel) private readonly reviewers: typeof RevisionReviewerModel,
    @InjectModel(ProjectMemberModel) private readonly members: typeof ProjectMemberModel,
    private readonly signOff: SignOffService,
    private readonly lookup: RevisionLookupService,
    private readonly mail: MailService,
    private readonly sequelize: Sequelize,
  ) {}

  async list(ref: RevisionRef): Promise<ReviewComment[]> {
    const { revision } = await this.lookup.find(ref);
    return this.threadsOf(revision.id);
  }

  async create(ref: RevisionRef, request: CreateCommentRequest, user: CurrentUser): Promise<ReviewComment> {
    const { projectId } = ref;
    const body = request.body.trim();
    if (!body) throw new DomainError('invalid_argument', 'body must not be empty', 'body');
    const id = await this.sequelize.transaction(async (transaction) => {
      const { design, revision } = await this.lookup.find(ref, transaction);
      let threadId: string | null = null;
      if (request.parentId !== undefined) {
        const parent = await this.comments.findOne({
          where: { id: request.parentId, revisionId: revision.id },
          transaction,
        });
        if (!parent)
          throw new DomainError('invalid_argument', 'parentId does not name a comment on this revision', 'parentId');
        if (request.anchor) {
          throw new DomainError('invalid_argument', 'a reply takes the anchor of its thread; send no anchor', 'anchor');
        }
        threadId = parent.parentId ?? parent.id;
      }
      const anchor = request.anchor ?? null;
      if (anchor && !hasPath(anchor.kind === 'input' ? revision.document : revision.report, anchor.path)) {
        const where = anchor.kind === 'input' ? 'an input field of this revision' : 'a result key of this revision';
        throw new DomainError('invalid_argument', `anchor.path '${anchor.path}' is not ${where}`, 'anchor.path');
      }
      const created = await this.comments.create(
        {
          revisionId: revision.id,
          parentId: threadId,
          authorId: user.id,
          body,
          anchorKind: anchor?.kind ?? null,
          anchorPath: anchor?.path ?? null,
        },
        { transaction },
      );

      const [assigned, threadRows, members] = await Promise.all([
        this.reviewers.findAll({ where: { revisionId: revision.id }, transaction }),
        threadId ? this.comments.findAll({ where: { revisionId: revision.id }, transaction }) : Promise.resolve([]),
        this.members.findAll({ where: { projectId }, include: [UserModel], transaction }),
      ]);
      const thread = threadRows.filter((row) => row.id === threadId || row.parentId === threadId);
      const root = thread.find((row) => row.id === threadId);
      const concerned = new Set([
        revision.authorId,
        ...assigned.map((row) => row.userId),
        ...thread.map((row) => row.authorId),
      ]);
      concerned.delete(user.id);
      const recipients = members
        .filter((member) => concerned.has(member.userId))
        .flatMap((member) => member.user?.email ?? []);
      const anchored =
        anchor ?? (root?.anchorKind && root.anchorPath ? { kind: root.anchorKind, path: root.anchorPath } : null);
      await this.mail.enqueue(
        [
          commentMail({
            about: this.signOff.mailSubject(projectId, design, revision.number),
            authorName: user.displayName,
            body,
            anchorLabel: anchored ? `${anchored.kind === 'input' ? 'input' : 'result'} ${anchored.path}` : null,
            isReply: threadId !== null,
            recipients,
          }),
        ],
        transaction,
      );
      return created.id;
    });
    this.mail.kick();
    return this.findOne(id);
  }

  /** Resolves or reopens a thread (its first comment). */
  async setResolved(input: {
    ref: RevisionRef;
    commentId: string;
    isResolved: boolean;
    user: CurrentUser;
  }): Promise<ReviewComment> {
    const { commentId, isResolved, user } = input;
    const { revision } = await this.lookup.find(input.ref);
    const comment = isUuid(commentId)
      ? await this.comments.findOne({ where: { id: commentId, revisionId: revision.id } })
      : null;
    if (!comment) throw new DomainError('not_found', 'Comment not found', 'commentId');
    if (comment.parentId !== null) {
      throw new DomainError(
        'invalid_argument',
        'only a thread (its first comment) can be resolved, not a reply',
        'commentId',
      );
    }
    await comment.update(
      isResolved ? { resolvedAt: new Date(), resolvedById: user.id } : { resolvedAt: null, resolvedById: null },
    );
    return this.findOne(comment.id);
  }

  private async findOne(id: string): Promise<ReviewComment> {
    const rows = await this.comments.findAll({
      where: { [Op.or]: [{ id }, { parentId: id }] },
      include: [
        { model: UserModel, as: 'author' },
        { model: UserModel, as: 'resolvedBy' },
      ],
      order: [['createdAt', 'ASC']],
    });
    const row = rows.find((candidate) => candidate.id === id);
    if (!row) throw new DomainError('not_found', 'Comment not found', 'commentId');
    return toComment(
      row,
      rows.filter((reply) => reply.parentId === id).map((reply) => toComment(reply, [])),
    );
  }

  private async threadsOf(revisionId: string): Promise<ReviewComment[]> {
    const rows = await this.comments.findAll({
      where: { revisionId },
      include: [
        { model: UserModel, as: 'author' },
        { model: UserModel, as: 'resolvedBy' },
      ],
      order: [['createdAt', 'ASC']],
    });
    return rows
      .filter((row) => row.parentId === null)
      .map((root) =>
        toComment(
          root,
          rows.filter((reply) => reply.parentId === root.id).map((reply) => toComment(reply, [])),
        ),
      );
  }
}
