import { Module } from '@nestjs/common';
import { UsersModule } from '../users/users.module.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { EmailTokensRepository } from './email-tokens.repository.js';
import { InvitationsController } from './invitations.controller.js';
import { InvitationsService } from './invitations.service.js';
import { PasswordHasher } from './password-hasher.js';
import { PasswordResetService } from './password-reset.service.js';
import { RefreshTokensRepository } from './refresh-tokens.repository.js';
import { SessionsService } from './sessions.service.js';

/** Sign-in, sessions, invitations and password resets (JWT and the guard are in AuthCoreModule). */
@Module({
  imports: [UsersModule],
  controllers: [AuthController, InvitationsController],
  providers: [
    AuthService,
    SessionsService,
    InvitationsService,
    PasswordResetService,
    PasswordHasher,
    RefreshTokensRepository,
    EmailTokensRepository,
  ],
})
export class AuthModule {}
