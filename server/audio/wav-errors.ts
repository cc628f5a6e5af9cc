// One error type for every way a file can fail to be a readable WAV, so the delivery check can
// turn any of them into a plain "fail" item instead of crashing.
export type WavErrorCode = 'not-wav' | 'truncated' | 'unsupported' | 'malformed' | 'io';

export class WavError extends Error {
  readonly code: WavErrorCode;

  constructor(code: WavErrorCode, message: string) {
    super(message);
    this.name = 'WavError';
    this.code = code;
  }
}

export function isWavError(error: unknown): error is WavError {
  return error instanceof WavError;
}
