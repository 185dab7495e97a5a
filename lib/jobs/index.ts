// What the concepts use to queue work. The worker (./worker) is not exported here: it registers
// the concepts' own jobs, so it sits above them and is imported by itself (instrumentation.ts, tests).
export { JOB_PRIORITY, enqueue } from "./enqueue";
export { defineJob } from "./handlers";
export { stopBoss } from "./boss";
