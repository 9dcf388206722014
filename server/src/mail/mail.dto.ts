import { MailListQuerySchema, MailListResponseSchema, MailMessageViewSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';

export class MailListQueryDto extends createZodDto(MailListQuerySchema) {}
export class MailListResponseDto extends createZodDto(MailListResponseSchema) {}
export class MailMessageViewDto extends createZodDto(MailMessageViewSchema) {}
