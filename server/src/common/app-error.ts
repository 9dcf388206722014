/** Error codes the client branches on. Add here; never reuse a code for another meaning. */
export enum ErrorCode {
  ValidationFailed = 'VALIDATION_FAILED',
  InvalidJson = 'INVALID_JSON',
  PayloadTooLarge = 'PAYLOAD_TOO_LARGE',
  Unauthenticated = 'UNAUTHENTICATED',
  Forbidden = 'FORBIDDEN',
  NotFound = 'NOT_FOUND',
  Conflict = 'CONFLICT',
  /** Separation of duties: whoever marked a finding fixed may not verify it (an organisation setting). */
  VerifierIsFixer = 'VERIFIER_IS_FIXER',
  /** A finished and signed inspection (and its control checks) is a statutory record: read-only. */
  InspectionSigned = 'INSPECTION_SIGNED',
  RateLimited = 'RATE_LIMITED',
  UnsupportedMediaType = 'UNSUPPORTED_MEDIA_TYPE',
  ServiceUnavailable = 'SERVICE_UNAVAILABLE',
  /** An image whose decoded size (width × height) is above the limit, however small its file. */
  ImageTooLarge = 'IMAGE_TOO_LARGE',
  /** Every upload slot of this server process is busy; retry shortly (Retry-After). */
  UploadsBusy = 'UPLOADS_BUSY',
  Internal = 'INTERNAL',
}

const STATUS: Record<ErrorCode, number> = {
  [ErrorCode.ValidationFailed]: 400,
  [ErrorCode.InvalidJson]: 400,
  [ErrorCode.PayloadTooLarge]: 413,
  [ErrorCode.Unauthenticated]: 401,
  [ErrorCode.Forbidden]: 403,
  [ErrorCode.NotFound]: 404,
  [ErrorCode.Conflict]: 409,
  [ErrorCode.VerifierIsFixer]: 403,
  [ErrorCode.InspectionSigned]: 409,
  [ErrorCode.RateLimited]: 429,
  [ErrorCode.UnsupportedMediaType]: 415,
  [ErrorCode.ServiceUnavailable]: 503,
  [ErrorCode.ImageTooLarge]: 413,
  [ErrorCode.UploadsBusy]: 503,
  [ErrorCode.Internal]: 500,
};

export interface ErrorIssue {
  path: (string | number)[];
  code: string;
  message: string;
}

/** The one error type services throw; the global filter turns it into `{ code, message, issues? }`. */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly issues?: ErrorIssue[],
  ) {
    super(message);
    this.name = 'AppError';
  }

  get status(): number {
    return STATUS[this.code];
  }

  static notFound(what: string): AppError {
    return new AppError(ErrorCode.NotFound, `${what} not found`);
  }
}

export function statusForCode(code: ErrorCode): number {
  return STATUS[code];
}
