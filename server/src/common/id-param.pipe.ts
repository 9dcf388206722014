import { Injectable, type PipeTransform } from '@nestjs/common';
import { AppError } from './app-error.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * A record id in the path. Something that is not a UUID cannot name any record, so it is answered
 * like an unknown id (404), never passed to PostgreSQL (where it would be a cast error).
 */
@Injectable()
export class IdParamPipe implements PipeTransform<string, string> {
  transform(value: string): string {
    if (typeof value !== 'string' || !UUID.test(value)) throw AppError.notFound('Record');
    return value.toLowerCase();
  }
}
