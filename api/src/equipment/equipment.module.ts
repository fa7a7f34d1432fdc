import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { EquipmentModel } from './equipment-model.entity.js';
import { EquipmentController } from './equipment.controller.js';
import { EquipmentService } from './equipment.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([EquipmentModel])],
  controllers: [EquipmentController],
  providers: [EquipmentService],
})
export class EquipmentModule {}
