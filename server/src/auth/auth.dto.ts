import {
  InvitationAcceptSchema,
  InvitationCreateSchema,
  PasswordResetConfirmSchema,
  PasswordResetRequestSchema,
  SessionRefreshSchema,
  SessionSchema,
  SignInSchema,
} from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';

export class SignInDto extends createZodDto(SignInSchema) {}
export class SessionDto extends createZodDto(SessionSchema) {}
export class SessionRefreshDto extends createZodDto(SessionRefreshSchema) {}
export class InvitationCreateDto extends createZodDto(InvitationCreateSchema) {}
export class InvitationAcceptDto extends createZodDto(InvitationAcceptSchema) {}
export class PasswordResetRequestDto extends createZodDto(PasswordResetRequestSchema) {}
export class PasswordResetConfirmDto extends createZodDto(PasswordResetConfirmSchema) {}
