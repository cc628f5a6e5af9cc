// A tiny logger: the level comes from LOG_LEVEL; tests run with 'silent'. Never pass secrets or tokens.
export type Logger = {
  info: (msg: string, ...rest: unknown[]) => void;
  error: (msg: string, ...rest: unknown[]) => void;
  debug: (msg: string, ...rest: unknown[]) => void;
};

const ORDER = { silent: 0, error: 1, info: 2, debug: 3 } as const;

export function createLogger(level: keyof typeof ORDER): Logger {
  const at = ORDER[level];
  return {
    error: (msg, ...rest) => at >= 1 && console.error(`[kitlane] ${msg}`, ...rest),
    info: (msg, ...rest) => at >= 2 && console.log(`[kitlane] ${msg}`, ...rest),
    debug: (msg, ...rest) => at >= 3 && console.log(`[kitlane:debug] ${msg}`, ...rest),
  };
}
