import { type CallHandler, type ExecutionContext, Injectable, type NestInterceptor } from '@nestjs/common';
import type { Response } from 'express';
import { catchError, type Observable, throwError } from 'rxjs';
import { RateLimitedError } from './rate-limited.error.js';

/** Adds `Retry-After` to 429 answers; the global filter then writes the usual error body. */
@Injectable()
export class RetryAfterInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return next.handle().pipe(
      catchError((error: unknown) => {
        if (error instanceof RateLimitedError && context.getType() === 'http') {
          context.switchToHttp().getResponse<Response>().setHeader('Retry-After', String(error.retryAfterS));
        }
        return throwError(() => error);
      }),
    );
  }
}
