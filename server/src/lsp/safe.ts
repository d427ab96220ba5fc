// The server never throws: every handler runs inside `guarded`, which turns an exception into a
// logged message and an empty answer, so one bad document cannot take the server down.

export type Logger = (message: string) => void;

let log: Logger = () => {};

export function setFaultLogger(logger: Logger): void {
  log = logger;
}

function describe(err: unknown): string {
  if (err instanceof Error) return err.stack ?? `${err.name}: ${err.message}`;
  return String(err);
}

export function reportFault(where: string, err: unknown): void {
  try {
    log(`Counterpoise: ${where} failed: ${describe(err)}`);
  } catch {
    // Logging itself failed (connection gone): nothing more can be done.
  }
}

/** Wraps a request or notification handler: on exception (or rejected promise) logs it and
 * answers `fallback`. */
export function guarded<P extends unknown[], R>(
  where: string,
  fallback: R,
  handler: (...params: P) => R | Promise<R>,
): (...params: P) => Promise<R> {
  return async (...params: P) => {
    try {
      return await handler(...params);
    } catch (err) {
      reportFault(where, err);
      return fallback;
    }
  };
}

/** Runs a synchronous piece of work that must not throw out of an event callback. */
export function attempt(where: string, work: () => void): void {
  try {
    work();
  } catch (err) {
    reportFault(where, err);
  }
}
