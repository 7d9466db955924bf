/** What a command may touch of the outside world; tests pass their own. */
export interface Io {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
  /** Whether stderr is a terminal (progress line). */
  readonly stderrIsTty?: boolean;
  /** Whether stdout is a terminal (colour in the text report). */
  readonly stdoutIsTty?: boolean;
}

/** Exit statuses: the delivery passed, it failed, or the run could not be judged. */
export const EXIT = { pass: 0, fail: 1, unusable: 2 } as const;
