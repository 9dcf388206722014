import { Body, Controller, Get, Patch } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { OrganisationSettingsSchema, OrganisationSettingsUpdateSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { OrganisationSettingsService } from './organisation-settings.service.js';

class OrganisationSettingsDto extends createZodDto(OrganisationSettingsSchema) {}
class OrganisationSettingsUpdateDto extends createZodDto(OrganisationSettingsUpdateSchema) {}

@ApiTags('organisation')
@ApiBearerAuth()
@Controller('organisation')
export class OrganisationsController {
  constructor(private readonly settings: OrganisationSettingsService) {}

  /** Every member reads the settings (phones need due times, proof-photo and verifier rules). */
  @Get('settings')
  @ApiOkResponse({ type: OrganisationSettingsDto })
  read(@CurrentUser() user: AuthUser) {
    return this.settings.read(user.organisationId);
  }

  @Patch('settings')
  @Roles('admin')
  @ApiOkResponse({ type: OrganisationSettingsDto })
  update(@CurrentUser() user: AuthUser, @Body() body: OrganisationSettingsUpdateDto) {
    return this.settings.update(user, body);
  }
}
