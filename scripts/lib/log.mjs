/** One-line messages from the start and test scripts. Built-ins only. */
export const say = (msg) => process.stdout.write(`[plummet] ${msg}\n`);

export class FatalError extends Error {}

/** Ends the process with one clear line (no stack) for problems the user can fix. */
export function fail(msg) {
  throw new FatalError(msg);
}

export function handleFatal(error) {
  if (error instanceof FatalError) {
    process.stderr.write(`[plummet] error: ${error.message}\n`);
  } else {
    process.stderr.write(`[plummet] error: ${error?.stack ?? error}\n`);
  }
  process.exitCode = 1;
}
