import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Tractor } from './entities/tractor.entity';
import { Trailer } from './entities/trailer.entity';
import { FleetController } from './fleet.controller';
import { FleetRepository } from './fleet.repository';
import { FleetService } from './fleet.service';

@Module({
  imports: [TypeOrmModule.forFeature([Tractor, Trailer]), AuditModule],
  controllers: [FleetController],
  providers: [FleetRepository, FleetService],
  exports: [FleetService, FleetRepository],
})
export class FleetModule {}
