import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { isUuid } from '../common/uuid';
import { DesignModel } from '../designs/design.model';
import { UserModel } from '../users/user.model';
import { revisionNotFound, type RevisionRef } from './revision-ref.decorator';
import { RevisionModel } from './revision.model';

/** A revision with its design, as every route below `revisions/:revisionNumber` works on it. */
export interface RevisionInContext {
  design: DesignModel;
  revision: RevisionModel;
}

/** The one place that loads the design and revision a route names. */
@Injectable()
export class RevisionLookupService {
  constructor(
    @InjectModel(DesignModel) private readonly designs: typeof DesignModel,
    @InjectModel(RevisionModel) private readonly revisions: typeof RevisionModel,
  ) {}

  /** The design `designId` of `projectId` (404 otherwise); in a transaction, under its row lock. */
  async findDesign(projectId: string, designId: string, transaction?: Transaction): Promise<DesignModel> {
    const design = isUuid(designId)
      ? await this.designs.findOne({
          where: { id: designId, projectId },
          ...(transaction ? { transaction, lock: transaction.LOCK.UPDATE } : {}),
        })
      : null;
    if (!design) throw revisionNotFound('designId', designId);
    return design;
  }

  /**
   * The design and revision `ref` names, the author included; 404 naming the field when either is not in the
   * project. With a transaction the design row is locked, which serializes every change of the design.
   */
  async find(ref: RevisionRef, transaction?: Transaction): Promise<RevisionInContext> {
    const design = await this.findDesign(ref.projectId, ref.designId, transaction);
    const revision = await this.findIn(design.id, ref.revisionNumber, transaction);
    if (!revision) throw revisionNotFound('revisionNumber', String(ref.revisionNumber));
    return { design, revision };
  }

  /** Revision `number` of a design already loaded, or null. */
  findIn(designId: string, number: number, transaction?: Transaction): Promise<RevisionModel | null> {
    return this.revisions.findOne({ where: { designId, number }, include: [UserModel], transaction });
  }
}
