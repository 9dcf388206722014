import { type CallHandler, type ExecutionContext, Inject, Injectable, type NestInterceptor } from '@nestjs/common';
import type { Response } from 'express';
import { finalize, type Observable } from 'rxjs';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';

/** Seconds a refused upload is told to wait; uploads finish in a few seconds. */
const RETRY_AFTER_S = 5;

/**
 * Caps the uploads one process reads and decodes at once (MAX_CONCURRENT_UPLOADS): each holds up
 * to MAX_UPLOAD_BYTES in memory and a decoded image, so the cap bounds memory whatever arrives.
 * Runs before the multipart parser, so a refused upload is never read. Per process on purpose:
 * it protects this process's memory, and another replica has its own.
 */
@Injectable()
export class UploadSlotsInterceptor implements NestInterceptor {
  private inFlight = 0;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (this.inFlight >= this.config.MAX_CONCURRENT_UPLOADS) {
      context.switchToHttp().getResponse<Response>().setHeader('Retry-After', String(RETRY_AFTER_S));
      throw new AppError(ErrorCode.UploadsBusy, 'The server is busy with other uploads; try again in a few seconds');
    }
    this.inFlight += 1;
    let released = false;
    const release = () => {
      if (released) return;
      released = true;
      this.inFlight -= 1;
    };
    try {
      return next.handle().pipe(finalize(release));
    } catch (error) {
      release();
      throw error;
    }
  }
}
