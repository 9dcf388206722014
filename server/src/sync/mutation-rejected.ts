import { AppError } from '../common/app-error.js';

/** A mutation that can never apply: recorded as rejected with this reason, and the client's counter moves on. */
export class MutationRejected extends Error {
  constructor(readonly reason: string) {
    super(reason);
    this.name = 'MutationRejected';
  }
}

/** PostgreSQL classes of a bad value or a broken constraint: the mutation's fault, not the server's. */
const MUTATION_FAULT_CLASSES = ['22', '23'];

export function pgCode(error: unknown): string | undefined {
  const e = error as { code?: unknown; cause?: { code?: unknown } };
  const code = typeof e?.code === 'string' ? e.code : typeof e?.cause?.code === 'string' ? e.cause.code : undefined;
  return code && /^[0-9A-Z]{5}$/.test(code) ? code : undefined;
}

/** The reason a thrown error rejects a mutation, or undefined when it must fail the whole push (and be retried). */
export function rejectionReason(error: unknown): string | undefined {
  if (error instanceof MutationRejected) return error.reason;
  if (error instanceof AppError && error.status < 500) {
    const issues = error.issues?.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    return issues ? `${error.message}: ${issues}` : error.message;
  }
  const code = pgCode(error);
  if (code && MUTATION_FAULT_CLASSES.includes(code.slice(0, 2))) return `The change breaks a rule of the data (${code})`;
  return undefined;
}

/** An error PostgreSQL answered (it aborts the transaction or savepoint it happened in). */
export function isDatabaseError(error: unknown): boolean {
  return pgCode(error) !== undefined;
}

/** Deadlock or serialization failure: the push is safe to retry. */
export function isRetryable(error: unknown): boolean {
  const code = pgCode(error);
  return code === '40P01' || code === '40001';
}
