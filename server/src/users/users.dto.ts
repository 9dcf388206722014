import { ForemanListResponseSchema, MemberListQuerySchema, MemberListResponseSchema, MemberSchema, MemberUpdateSchema, UserProfileSchema, UserProfileUpdateSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';

export class UserProfileDto extends createZodDto(UserProfileSchema) {}
export class UserProfileUpdateDto extends createZodDto(UserProfileUpdateSchema) {}
export class MemberDto extends createZodDto(MemberSchema) {}
export class MemberListResponseDto extends createZodDto(MemberListResponseSchema) {}
export class MemberListQueryDto extends createZodDto(MemberListQuerySchema) {}
export class MemberUpdateDto extends createZodDto(MemberUpdateSchema) {}
export class ForemanListResponseDto extends createZodDto(ForemanListResponseSchema) {}
