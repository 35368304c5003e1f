import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { RevisionsModule } from '../revisions/revisions.module';
import { StorageModule } from '../storage/storage.module';
import { BenchRunEventModel } from './bench-run-event.model';
import { BenchRunFileModel } from './bench-run-file.model';
import { BenchRunModel } from './bench-run.model';
import { BenchRunsController } from './bench-runs.controller';
import { BenchRunsService } from './bench-runs.service';

/** Exports BenchRunsService: `listForRevision` gives Sign-off and the spec sheet a revision's runs and verdicts. */
@Module({
  imports: [
    SequelizeModule.forFeature([BenchRunModel, BenchRunFileModel, BenchRunEventModel]),
    StorageModule,
    RevisionsModule,
  ],
  controllers: [BenchRunsController],
  providers: [BenchRunsService],
  exports: [BenchRunsService],
})
export class BenchRunsModule {}
