import { createSecretKey } from 'node:crypto';
import { Global, Module } from '@nestjs/common';
import { APP_GUARD, APP_INTERCEPTOR } from '@nestjs/core';
import { JwtModule } from '@nestjs/jwt';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { OrganisationScopeInterceptor } from './organisation-scope.interceptor.js';
import { AuthGuard } from './auth.guard.js';
import { SessionStateCache } from './session-state.cache.js';
import { SessionStateRepository } from './session-state.repository.js';

/** JWT signing/verification and the global guard; sign-in routes live in AuthModule. */
@Global()
@Module({
  imports: [
    JwtModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        // A key object made once: given a string, jsonwebtoken first tries to parse it as a public
        // key (which throws) and then builds a secret key, on every sign and verify.
        secret: createSecretKey(Buffer.from(config.JWT_SECRET)) as unknown as string,
        signOptions: { expiresIn: config.ACCESS_TOKEN_TTL_S, algorithm: 'HS256' },
        verifyOptions: { algorithms: ['HS256'] },
      }),
    }),
  ],
  providers: [{ provide: APP_GUARD, useClass: AuthGuard }, { provide: APP_INTERCEPTOR, useClass: OrganisationScopeInterceptor }, SessionStateRepository, SessionStateCache],
  exports: [JwtModule, SessionStateRepository, SessionStateCache],
})
export class AuthCoreModule {}
