import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { PartModel } from './part.model';
import { PartsCsvService } from './parts-csv.service';
import { PartsController } from './parts.controller';
import { PartsService } from './parts.service';

@Module({
  imports: [SequelizeModule.forFeature([PartModel])],
  controllers: [PartsController],
  providers: [PartsService, PartsCsvService],
  exports: [PartsService],
})
export class PartsModule {}
