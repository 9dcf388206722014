import { HttpException, HttpStatus } from '@nestjs/common';
import { ZodValidationException } from 'nestjs-zod';
import { ZodError } from 'zod';
import { AppError, ErrorCode, type ErrorIssue, statusForCode } from './app-error.js';

export interface ErrorBody {
  code: string;
  message: string;
  issues?: ErrorIssue[];
}

function zodIssues(error: ZodError): ErrorIssue[] {
  return error.issues.map((i) => ({
    path: i.path.map((p) => (typeof p === 'symbol' ? String(p) : p)),
    code: i.code,
    message: i.message,
  }));
}

const CODE_BY_STATUS: Record<number, ErrorCode> = {
  [HttpStatus.BAD_REQUEST]: ErrorCode.ValidationFailed,
  [HttpStatus.UNAUTHORIZED]: ErrorCode.Unauthenticated,
  [HttpStatus.FORBIDDEN]: ErrorCode.Forbidden,
  [HttpStatus.NOT_FOUND]: ErrorCode.NotFound,
  [HttpStatus.CONFLICT]: ErrorCode.Conflict,
  [HttpStatus.PAYLOAD_TOO_LARGE]: ErrorCode.PayloadTooLarge,
  [HttpStatus.UNSUPPORTED_MEDIA_TYPE]: ErrorCode.UnsupportedMediaType,
  [HttpStatus.TOO_MANY_REQUESTS]: ErrorCode.RateLimited,
  [HttpStatus.SERVICE_UNAVAILABLE]: ErrorCode.ServiceUnavailable,
};

/** Errors raised by body-parser/multer before any controller runs carry a `type` or `code`. */
interface LowLevelError {
  type?: string;
  code?: string;
  status?: number;
  statusCode?: number;
  message?: string;
}

/** Maps anything thrown to a status and the public error body. Never includes a stack. */
export function toErrorBody(error: unknown): { status: number; body: ErrorBody } {
  // The Express adapter wraps body-parser errors in an HttpException; answer from the original.
  if (error instanceof HttpException && (error.cause as LowLevelError | undefined)?.type) {
    return toErrorBody(error.cause);
  }
  if (error instanceof AppError) {
    return { status: error.status, body: { code: error.code, message: error.message, issues: error.issues } };
  }
  if (error instanceof ZodValidationException) {
    const zodError = error.getZodError();
    return {
      status: 400,
      body: {
        code: ErrorCode.ValidationFailed,
        message: 'The request is not valid',
        issues: zodError instanceof ZodError ? zodIssues(zodError) : undefined,
      },
    };
  }
  if (error instanceof ZodError) {
    return { status: 400, body: { code: ErrorCode.ValidationFailed, message: 'The request is not valid', issues: zodIssues(error) } };
  }
  if (error instanceof HttpException) {
    const status = error.getStatus();
    const code = CODE_BY_STATUS[status] ?? (status >= 500 ? ErrorCode.Internal : ErrorCode.ValidationFailed);
    const response = error.getResponse();
    const message =
      typeof response === 'string'
        ? response
        : typeof (response as { message?: unknown }).message === 'string'
          ? (response as { message: string }).message
          : error.message;
    return { status, body: { code, message: status >= 500 ? 'Internal error' : message } };
  }
  const low = (error ?? {}) as LowLevelError;
  if (low.type === 'entity.parse.failed') {
    return { status: 400, body: { code: ErrorCode.InvalidJson, message: 'The request body is not valid JSON' } };
  }
  if (low.type === 'entity.too.large' || low.code === 'LIMIT_FILE_SIZE') {
    return { status: 413, body: { code: ErrorCode.PayloadTooLarge, message: 'The request is too large' } };
  }
  const lowStatus = low.status ?? low.statusCode;
  if (typeof lowStatus === 'number' && lowStatus >= 400 && lowStatus < 500) {
    const code = CODE_BY_STATUS[lowStatus] ?? ErrorCode.ValidationFailed;
    return { status: lowStatus, body: { code, message: low.message ?? 'Bad request' } };
  }
  return { status: statusForCode(ErrorCode.Internal), body: { code: ErrorCode.Internal, message: 'Internal error' } };
}
