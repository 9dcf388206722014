import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import multer from 'multer';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { StorageModule } from '../storage/storage.module.js';
import { PhotosController } from './photos.controller.js';
import { PhotosRepository } from './photos.repository.js';
import { PhotosService } from './photos.service.js';
import { UploadSlotsInterceptor } from './upload-slots.interceptor.js';

/**
 * Photo uploads (kept in memory up to MAX_UPLOAD_BYTES, at most MAX_CONCURRENT_UPLOADS at once per
 * process, one file per request, a few short text fields), processed with sharp and stored by
 * content hash in object storage.
 */
@Module({
  imports: [
    StorageModule,
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        storage: multer.memoryStorage(),
        limits: { fileSize: config.MAX_UPLOAD_BYTES, files: 1, fields: 8, fieldSize: 200, parts: 9 },
      }),
    }),
  ],
  controllers: [PhotosController],
  providers: [PhotosService, PhotosRepository, UploadSlotsInterceptor],
})
export class PhotosModule {}
