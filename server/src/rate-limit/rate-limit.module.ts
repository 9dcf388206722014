import { Global, Module } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { RateLimitRepository } from './rate-limit.repository.js';
import { RateLimitService } from './rate-limit.service.js';
import { RetryAfterInterceptor } from './retry-after.interceptor.js';

@Global()
@Module({
  providers: [RateLimitRepository, RateLimitService, { provide: APP_INTERCEPTOR, useClass: RetryAfterInterceptor }],
  exports: [RateLimitService],
})
export class RateLimitModule {}
