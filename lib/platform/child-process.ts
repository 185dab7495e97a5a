import { spawn, type ChildProcess, type SpawnOptions } from "node:child_process";

// Children run in their own process group so that a stop reaches every process they started
// (`next start` serves from a forked child; signalling only the parent would leave that child running).
export function spawnGroup(command: string, args: string[], options: SpawnOptions): ChildProcess {
  return spawn(command, args, { ...options, detached: true });
}

function signalGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  if (child.pid === undefined || child.exitCode !== null || child.signalCode !== null) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    // the group is already gone
  }
}

/** Sends SIGTERM, waits up to `graceMs`, then SIGKILL; resolves when the child has exited. */
export function stopGroup(child: ChildProcess, graceMs = 10_000): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => signalGroup(child, "SIGKILL"), graceMs);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    signalGroup(child, "SIGTERM");
  });
}

export function waitForExit(child: ChildProcess): Promise<number> {
  if (child.exitCode !== null) return Promise.resolve(child.exitCode);
  return new Promise((resolve) => child.once("exit", (code, signal) => resolve(code ?? (signal ? 1 : 0))));
}
