/** What a command may touch of the outside world; tests pass their own. */
export interface Io {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
  /** Whether stderr is a terminal (progress and colour). */
  readonly stderrIsTty?: boolean;
}

/** Exit statuses: the delivery passed, it failed, or the run could not be judged. */
export const EXIT = { pass: 0, fail: 1, unusable: 2 } as const;
