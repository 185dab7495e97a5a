import { log } from "./log";

type Cleanup = { name: string; run: () => void | Promise<void> };

/**
 * Collects what a command started and tears it down in reverse order exactly once: on success,
 * on failure, and on Ctrl-C / SIGTERM. PostgreSQL is always stopped last, after the app.
 */
export class Lifecycle {
  private cleanups: Cleanup[] = [];
  private stopping: Promise<void> | undefined;

  /** One-shot commands (stats:rebuild) may use the cluster a running `npm start` owns; servers may not. */
  constructor(readonly mayShareRunningCluster = false) {
    for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
      process.on(signal, () => {
        log(`${signal} received, shutting down ...`);
        void this.stop().then(() => process.exit(signal === "SIGINT" ? 130 : 143));
      });
    }
  }

  onStop(name: string, run: Cleanup["run"]): void {
    this.cleanups.push({ name, run });
  }

  stop(): Promise<void> {
    this.stopping ??= (async () => {
      for (const cleanup of this.cleanups.reverse()) {
        try {
          await cleanup.run();
        } catch (error) {
          console.error(`[shuntbook] stopping ${cleanup.name} failed:`, error);
        }
      }
    })();
    return this.stopping;
  }
}
