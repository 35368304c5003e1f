import { Module } from '@nestjs/common';
import { RevisionsModule } from '../revisions/revisions.module';
import { SimulationsModule } from '../simulations/simulations.module';
import { CalibrationsController } from './calibrations.controller';
import { CalibrationsService } from './calibrations.service';

/** Calibrations of a revision against its bench runs, run as simulation jobs. */
@Module({
  imports: [RevisionsModule, SimulationsModule],
  controllers: [CalibrationsController],
  providers: [CalibrationsService],
  exports: [CalibrationsService],
})
export class CalibrationsModule {}
