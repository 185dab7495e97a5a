// Next.js calls register() once when a server process starts. The job worker (lib/jobs) runs
// inside the app's Node.js server so that `npm start` needs no second process; it is skipped on
// the Edge runtime, during `next build`, and where SHUNTBOOK_JOB_WORKER=0 (web-only instances).
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // the models' connection takes its settings from lib/env through lib/db; every route and the
  // worker share it (the settings are read on the first query, not here)
  await import("@/lib/db/sequelize");
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { env } = await import("@/lib/env");
  if (env().SHUNTBOOK_JOB_WORKER === "0") return;
  const { startJobWorker } = await import("@/lib/jobs/worker");
  // a database that is not up yet must not stop the web server: log, and try again in 30 s
  const start = (): Promise<void> =>
    startJobWorker().catch((error) => {
      console.error("[jobs] the worker did not start; trying again in 30 s:", error);
      setTimeout(start, 30_000).unref();
    });
  await start();
}
