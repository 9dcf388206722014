import { createZodDto } from '../common/zod-dto.js';
import { PhotoIdParamsSchema, PhotoListQuerySchema, PhotoListSchema, PhotoSchema, PhotoUploadSchema } from '@plummet/shared';

export class PhotoUploadDto extends createZodDto(PhotoUploadSchema) {}
export class PhotoListQueryDto extends createZodDto(PhotoListQuerySchema) {}
export class PhotoIdParamsDto extends createZodDto(PhotoIdParamsSchema) {}
export class PhotoDto extends createZodDto(PhotoSchema) {}
export class PhotoListDto extends createZodDto(PhotoListSchema) {}
