import { MailListQuerySchema, MailListSchema } from '@plummet/shared';
import { createZodDto } from 'nestjs-zod';

export class MailListQueryDto extends createZodDto(MailListQuerySchema) {}
export class MailListDto extends createZodDto(MailListSchema) {}
