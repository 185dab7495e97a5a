import { PASSWORD_RESET_JOB } from "./password-reset";
import { SIGN_UP_JOB } from "./sign-up";

// lib/auth's jobs, for the worker (lib/jobs/worker.ts): importing this defines them (defineJob runs
// when their modules load), and the names tell the worker which queues to work first.
export const AUTH_JOBS: readonly string[] = [SIGN_UP_JOB, PASSWORD_RESET_JOB];
