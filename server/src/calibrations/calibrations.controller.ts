import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type {
  CalibratedRevisionResponse,
  Calibration,
  CalibrationParameterOption,
  CurrentUser as SessionUser,
} from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import { RevisionRef } from '../revisions/revision-ref.decorator';
import { CalibrationsService } from './calibrations.service';
import { StartCalibrationDto } from './dto/start-calibration.dto';

@ApiTags('calibrations')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber/calibrations')
export class CalibrationsController {
  constructor(private readonly calibrations: CalibrationsService) {}

  /** The uncertain parameters the engine can fit for this revision, with their declared prior ranges. */
  @Get('parameters')
  parameters(@RevisionRef() ref: RevisionRef): Promise<CalibrationParameterOption[]> {
    return this.calibrations.parameters(ref);
  }

  /** Checks the data (400 naming the run and the column) and queues the fit; poll it for progress. */
  @Post()
  @HttpCode(202)
  @RequiresProjectAction('design.write')
  start(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Body() body: StartCalibrationDto,
  ): Promise<Calibration> {
    return this.calibrations.start(ref, user.id, body);
  }

  @Get()
  list(@RevisionRef() ref: RevisionRef): Promise<Calibration[]> {
    return this.calibrations.list(ref);
  }

  @Get(':calibrationId')
  get(@RevisionRef() ref: RevisionRef, @Param('calibrationId') calibrationId: string): Promise<Calibration> {
    return this.calibrations.get(ref, calibrationId);
  }

  @Post(':calibrationId/cancel')
  @HttpCode(200)
  @RequiresProjectAction('design.write')
  cancel(@RevisionRef() ref: RevisionRef, @Param('calibrationId') calibrationId: string): Promise<Calibration> {
    return this.calibrations.cancel(ref, calibrationId);
  }

  /** Saves the next revision of the design with the fitted values and a change note naming the bench runs. */
  @Post(':calibrationId/revision')
  @HttpCode(201)
  @RequiresProjectAction('design.write')
  startRevision(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Param('calibrationId') calibrationId: string,
  ): Promise<CalibratedRevisionResponse> {
    return this.calibrations.startRevision(ref, calibrationId, user.id);
  }
}
