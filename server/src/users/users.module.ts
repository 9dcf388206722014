import { Module } from '@nestjs/common';
import { UserSettingsCommands } from './user-settings-commands.js';
import { UserSettingsRepository } from './user-settings.repository.js';
import { UsersController } from './users.controller.js';
import { UsersRepository } from './users.repository.js';
import { UsersService } from './users.service.js';

/** Profiles and organisation members; AuthModule builds sessions and invitations on its repository. */
@Module({
  controllers: [UsersController],
  providers: [UsersService, UsersRepository, UserSettingsRepository, UserSettingsCommands],
  exports: [UsersRepository, UserSettingsCommands],
})
export class UsersModule {}
