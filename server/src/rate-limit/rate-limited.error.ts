import { AppError, ErrorCode } from '../common/app-error.js';

/** 429 RATE_LIMITED; RetryAfterInterceptor copies `retryAfterS` into the Retry-After header. */
export class RateLimitedError extends AppError {
  constructor(readonly retryAfterS: number) {
    const minutes = Math.max(1, Math.ceil(retryAfterS / 60));
    super(ErrorCode.RateLimited, `Too many attempts; try again in ${minutes} minute${minutes === 1 ? '' : 's'}`);
  }
}
