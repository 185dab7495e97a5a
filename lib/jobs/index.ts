export { enqueue } from "./enqueue";
export { drainJobsOnce, startJobWorker, type DrainResult } from "./worker";
export { stopBoss } from "./boss";
export { JOBS, type JobName } from "./handlers";
