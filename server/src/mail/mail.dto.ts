import { MailListQuerySchema, MailListResponseSchema, MailMessageViewSchema } from '@plummet/shared';
import { createZodDto } from 'nestjs-zod';

export class MailListQueryDto extends createZodDto(MailListQuerySchema) {}
export class MailListResponseDto extends createZodDto(MailListResponseSchema) {}
export class MailMessageViewDto extends createZodDto(MailMessageViewSchema) {}
