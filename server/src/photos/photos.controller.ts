import { Body, Controller, Delete, Get, HttpCode, Param, Post, Query, Req, Res, StreamableFile, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import { PHOTO_OWNER_TYPES, PHOTO_STORED_MEDIA_TYPE, type Photo, type PhotoList } from '@plummet/shared';
import type { Request, Response } from 'express';
import { CurrentUser } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { PhotoDto, PhotoIdParamsDto, PhotoListDto, PhotoListQueryDto, PhotoUploadDto } from './photos.dto.js';
import { PhotosService, type PhotoVariant, type UploadedImage } from './photos.service.js';
import { UploadSlotsInterceptor } from './upload-slots.interceptor.js';

/** Stored images never change under their id (content-addressed), so caches may keep them. */
const IMAGE_CACHE_CONTROL = 'private, max-age=31536000, immutable';

function etagMatches(header: string | undefined, etag: string): boolean {
  if (!header) return false;
  return header.split(',').some((t) => {
    const tag = t.trim().replace(/^W\//, '');
    return tag === '*' || tag === etag;
  });
}

@ApiTags('photos')
@ApiBearerAuth()
@Controller('photos')
export class PhotosController {
  constructor(private readonly photos: PhotosService) {}

  /** Every role may call it; who may attach to what is decided per owner (see photo-access.ts). */
  @Post()
  @UseInterceptors(UploadSlotsInterceptor, FileInterceptor('file'))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['id', 'ownerType', 'ownerId', 'file'],
      properties: {
        id: { type: 'string', format: 'uuid', description: 'Generated on the phone; a retry with the same id stores nothing new' },
        ownerType: { type: 'string', enum: [...PHOTO_OWNER_TYPES] },
        ownerId: { type: 'string', format: 'uuid' },
        takenAt: { type: 'string', format: 'date-time' },
        file: { type: 'string', format: 'binary', description: 'JPEG, PNG, WebP or HEIC; at most MAX_UPLOAD_BYTES' },
      },
    },
  })
  @ApiCreatedResponse({ type: PhotoDto, description: 'Stored (200 with the same body when the id was uploaded before)' })
  async upload(
    @CurrentUser() user: AuthUser,
    @Body() fields: PhotoUploadDto,
    @UploadedFile() file: UploadedImage | undefined,
    @Res({ passthrough: true }) res: Response,
  ): Promise<Photo> {
    const { photo, created } = await this.photos.upload(user, fields, file);
    res.status(created ? 201 : 200);
    return photo;
  }

  @Get()
  @ApiOkResponse({ type: PhotoListDto })
  async list(@CurrentUser() user: AuthUser, @Query() query: PhotoListQueryDto): Promise<PhotoList> {
    return { items: await this.photos.list(user, query) };
  }

  @Get(':id')
  @ApiProduces(PHOTO_STORED_MEDIA_TYPE)
  image(@CurrentUser() user: AuthUser, @Param() params: PhotoIdParamsDto, @Req() req: Request, @Res({ passthrough: true }) res: Response) {
    return this.send(user, params.id, 'photo', req, res);
  }

  @Get(':id/thumbnail')
  @ApiProduces(PHOTO_STORED_MEDIA_TYPE)
  thumbnail(@CurrentUser() user: AuthUser, @Param() params: PhotoIdParamsDto, @Req() req: Request, @Res({ passthrough: true }) res: Response) {
    return this.send(user, params.id, 'thumbnail', req, res);
  }

  /** The uploader, managers and admins. */
  @Delete(':id')
  @HttpCode(204)
  async remove(@CurrentUser() user: AuthUser, @Param() params: PhotoIdParamsDto): Promise<void> {
    await this.photos.remove(user, params.id);
  }

  private async send(user: AuthUser, id: string, variant: PhotoVariant, req: Request, res: Response): Promise<StreamableFile | undefined> {
    const row = await this.photos.get(user, id);
    const etag = variant === 'photo' ? `"${row.contentHash}"` : `"${row.contentHash}-thumbnail"`;
    res.setHeader('ETag', etag);
    res.setHeader('Cache-Control', IMAGE_CACHE_CONTROL);
    if (etagMatches(req.headers['if-none-match'], etag)) {
      res.status(304);
      return undefined;
    }
    const object = await this.photos.openObject(row, variant);
    return new StreamableFile(object.body, { type: PHOTO_STORED_MEDIA_TYPE, length: object.contentLength });
  }
}
