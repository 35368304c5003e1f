import { Global, Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditController } from './audit.controller';
import { AuditEntryModel } from './audit-entry.model';
import { AuditService } from './audit.service';

/** Global so that any feature module can inject `AuditService` without importing this module. */
@Global()
@Module({
  imports: [SequelizeModule.forFeature([AuditEntryModel])],
  controllers: [AuditController],
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
