import { randomBytes } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { QueryTypes, type Sequelize } from "sequelize";
import { migrateUp, seedUp } from "@/lib/db/migrate";
import { createSequelize } from "@/lib/db/sequelize";
import { env, resetEnvCache } from "@/lib/env";
import { rebuildAllStats } from "@/lib/published/rebuild";
import { spawnGroup, stopGroup } from "@/lib/platform/child-process";
import { Lifecycle } from "@/lib/platform/lifecycle";
import { log } from "@/lib/platform/log";
import { nextBin, serverEnv } from "@/lib/platform/next-build";
import { createAppDatabase, describeCluster, initCluster, secureCluster, startCluster, stopCluster, type Cluster } from "@/lib/platform/postgres-cluster";
import { freePort, waitForHttp } from "@/lib/platform/wait-for-http";
import { sessionCookieForAccount, testAccount } from "@/tests/support/auth";
import { flyRechargeBody } from "@/tests/support/submission-body";

// `npm run chaos`: a bounded write load (quads, submissions, approvals) against the production
// build while PostgreSQL is killed with SIGKILL and restarted and the app is killed with SIGKILL
// and restarted, then: every acknowledged write is there (0 lost), no submission without its
// cycles (0 partial), and board_stats equal to a fresh recompute (lib/published/rebuild.ts).
// Everything runs on a throwaway cluster in a temporary folder on free ports (never .data) and
// is stopped again on success, failure or Ctrl-C. Not part of npm test. Needs `npm run build`.

// `npm run chaos -- 90` runs 90 s of load; the four faults are spread over it
const DEFAULT_SECONDS = 90;
const WORKERS = 4;
/** When each fault strikes, as a share of the run: PostgreSQL, the app, PostgreSQL, the app. */
const FAULT_PLAN: Array<{ share: number; what: "postgres" | "app" }> = [
  { share: 0.15, what: "postgres" },
  { share: 0.35, what: "app" },
  { share: 0.55, what: "postgres" },
  { share: 0.75, what: "app" },
];

type Acked = { quads: Map<number, string>; submissions: Map<number, number>; approvals: Set<number> };
type Figures = { attempted: number; acknowledged: number; refused: Record<string, number>; networkErrors: number };

function killPostgres(cluster: Cluster): number {
  const pid = Number(readFileSync(path.join(cluster.dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
  process.kill(pid, "SIGKILL");
  return pid;
}

async function waitUntilGone(pid: number): Promise<void> {
  for (;;) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
}

export async function runChaos(args: string[]): Promise<number> {
  const root = process.cwd();
  const seconds = Number(args[0] ?? DEFAULT_SECONDS);
  if (!Number.isFinite(seconds) || seconds < 20 || seconds > 3600) throw new Error("usage: npm run chaos -- [seconds of load, 20–3600]");
  const DURATION_MS = seconds * 1000;
  const FAULTS = FAULT_PLAN.map((f) => ({ at: Math.round(f.share * DURATION_MS), what: f.what }));
  if (!existsSync(path.join(root, env().SHUNTBOOK_NEXT_DIST_DIR, "BUILD_ID"))) throw new Error("no production build: run `npm run build` first");
  const lifecycle = new Lifecycle();
  try {
    const scratch = mkdtempSync(path.join(os.tmpdir(), "shuntbook-chaos-"));
    lifecycle.onStop("the chaos scratch folder", () => rmSync(scratch, { recursive: true, force: true }));
    const cluster = describeCluster(scratch, await freePort());
    initCluster(cluster);
    startCluster(cluster, { durable: true });
    lifecycle.onStop("PostgreSQL", () => stopCluster(cluster));
    const database = "shuntbook_chaos";
    await secureCluster(cluster);
    await createAppDatabase(cluster, database);
    const url = cluster.url(database);
    const setup = createSequelize(url, { poolMax: 2 });
    await migrateUp(setup, root);
    await seedUp(setup);
    await setup.close();

    process.env.DATABASE_URL = url;
    process.env.NEXTAUTH_SECRET = randomBytes(32).toString("base64url");
    resetEnvCache();
    const cookies = await Promise.all(
      Array.from({ length: WORKERS }, async (_, i) => sessionCookieForAccount(await testAccount("contributor", { email: `chaos-${i}@chaos.test` }))),
    );
    const moderator = await sessionCookieForAccount(await testAccount("moderator", { email: "chaos-moderator@chaos.test" }));
    const probe = createSequelize(url, { poolMax: 2 });
    const [target] = await probe.query<{ revision: number; family: number }>(
      "SELECT (SELECT min(id) FROM board_revisions) AS revision, (SELECT min(id) FROM firmware_families) AS family",
      { type: QueryTypes.SELECT },
    );
    await probe.close();

    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    const appEnv = serverEnv(root, {
      ...process.env,
      NODE_ENV: "production" as const,
      DATABASE_URL: url,
      PORT: String(port),
      NEXTAUTH_URL: base,
      NEXT_TELEMETRY_DISABLED: "1",
    });
    let app = spawnGroup(process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(port)], {
      cwd: root,
      stdio: ["ignore", "ignore", "inherit"],
      env: appEnv,
    });
    const startApp = () => {
      app = spawnGroup(process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(port)], {
        cwd: root,
        stdio: ["ignore", "ignore", "inherit"],
        env: appEnv,
      });
    };
    lifecycle.onStop("the app", () => stopGroup(app));
    await waitForHttp(`${base}/api/v1/health`, 120_000);

    const acked: Acked = { quads: new Map(), submissions: new Map(), approvals: new Set() };
    const figures: Figures = { attempted: 0, acknowledged: 0, refused: {}, networkErrors: 0 };
    const post = async (
      cookie: string,
      pathname: string,
      body: unknown,
    ): Promise<{ status: number; json: Record<string, { id: number; version: number; name?: string }> } | null> => {
      figures.attempted++;
      try {
        const res = await fetch(`${base}${pathname}`, {
          method: "POST",
          headers: { cookie, "content-type": "application/json" },
          body: JSON.stringify(body),
          signal: AbortSignal.timeout(15_000),
        });
        // the app killed between the status line and the body: the write may have happened, but
        // the client never learned its id, so it is not counted as acknowledged
        const json = await res.json().catch(() => null);
        if (json === null) {
          figures.networkErrors++;
          return null;
        }
        if (res.status < 300) figures.acknowledged++;
        else {
          const key = `${res.status} ${pathname.replace(/\/\d+/g, "/{id}")}`;
          figures.refused[key] = (figures.refused[key] ?? 0) + 1;
        }
        return { status: res.status, json };
      } catch {
        figures.networkErrors++;
        return null;
      }
    };

    const started = Date.now();
    const running = () => Date.now() - started < DURATION_MS;
    const pendingApproval: Array<{ id: number; version: number }> = [];
    const worker = async (i: number) => {
      for (let seq = 0; running(); seq++) {
        const name = `chaos ${i}-${seq}`;
        const quad = await post(cookies[i], "/api/v1/garage/quads", { name });
        if (quad?.status === 201 && quad.json.quad?.id) acked.quads.set(quad.json.quad.id, name);
        const submission = await post(
          cookies[i],
          "/api/v1/submissions",
          flyRechargeBody({ boardRevisionId: target.revision, firmwareFamilyId: target.family }, { currentScale: 1840 + (seq % 12) }),
        );
        if (submission?.status === 201 && submission.json.submission?.id) {
          acked.submissions.set(submission.json.submission.id, 2);
          pendingApproval.push({ id: submission.json.submission.id, version: submission.json.submission.version });
        }
        if (!quad && !submission) await new Promise((r) => setTimeout(r, 250));
      }
    };
    const approver = async () => {
      while (running()) {
        const next = pendingApproval.shift();
        if (!next) {
          await new Promise((r) => setTimeout(r, 50));
          continue;
        }
        const res = await post(moderator, `/api/v1/moderation/submissions/${next.id}/approve`, { version: next.version });
        if (res && res.status === 200) acked.approvals.add(next.id);
        else if (!res || res.status >= 500 || res.status === 503) pendingApproval.push(next); // try again later
      }
    };
    const faults = (async () => {
      for (const fault of FAULTS) {
        await new Promise((r) => setTimeout(r, Math.max(0, started + fault.at - Date.now())));
        if (fault.what === "postgres") {
          const pid = killPostgres(cluster);
          log(`chaos: PostgreSQL (pid ${pid}) killed with SIGKILL at ${Date.now() - started} ms`);
          await waitUntilGone(pid);
          await new Promise((r) => setTimeout(r, 1_000));
          startCluster(cluster, { durable: true });
          log(`chaos: PostgreSQL restarted (crash recovery done) at ${Date.now() - started} ms`);
        } else {
          const pid = app.pid!;
          process.kill(-pid, "SIGKILL");
          log(`chaos: app (pid ${pid}) killed with SIGKILL at ${Date.now() - started} ms`);
          await waitUntilGone(pid);
          startApp();
          await waitForHttp(`${base}/api/v1/health`, 120_000);
          log(`chaos: app restarted and healthy at ${Date.now() - started} ms`);
        }
      }
    })();
    await Promise.all([...Array.from({ length: WORKERS }, (_, i) => worker(i)), approver(), faults]);
    const elapsed = Date.now() - started;
    await waitForHttp(`${base}/api/v1/health`, 120_000);

    const check = createSequelize(url, { poolMax: 2 });
    try {
      const result = await verify(check, acked);
      const report = [
        `chaos: ${elapsed} ms of load, ${WORKERS} writers and one moderator, faults: ${FAULTS.map((f) => `${f.what} kill -9 at ${f.at / 1000} s`).join(", ")}`,
        `chaos: requests ${figures.attempted}, acknowledged writes ${figures.acknowledged} (quads ${acked.quads.size}, submissions ${acked.submissions.size}, approvals ${acked.approvals.size}), refused ${JSON.stringify(figures.refused)}, connection errors ${figures.networkErrors}`,
        `chaos: lost ${result.lost}, partial ${result.partial}, board_stats rows ${result.statsRows}, differing from a fresh recompute ${result.statsDiffer}`,
      ];
      for (const line of report) log(line);
      const fiveXX = Object.entries(figures.refused)
        .filter(([key]) => Number(key.split(" ")[0]) >= 500 && !key.startsWith("503 "))
        .reduce((n, [, c]) => n + c, 0);
      if (fiveXX) log(`chaos: ${fiveXX} 5xx answers other than 503`);
      return result.lost === 0 && result.partial === 0 && result.statsDiffer === 0 ? 0 : 1;
    } finally {
      await check.close();
    }
  } finally {
    await lifecycle.stop();
  }
}

async function verify(sequelize: Sequelize, acked: Acked): Promise<{ lost: number; partial: number; statsRows: number; statsDiffer: number }> {
  let lost = 0;
  const quads = await sequelize.query<{ id: number; name: string }>("SELECT id, name FROM quads WHERE id = ANY($1)", {
    bind: [[...acked.quads.keys()]],
    type: QueryTypes.SELECT,
  });
  const found = new Map(quads.map((q) => [q.id, q.name]));
  for (const [id, name] of acked.quads) if (found.get(id) !== name) lost++;
  const submissions = await sequelize.query<{ id: number; status: string; cycles: string }>(
    "SELECT s.id, s.status, (SELECT count(*) FROM submission_cycles c WHERE c.submission_id = s.id) AS cycles FROM submissions s WHERE s.id = ANY($1)",
    { bind: [[...acked.submissions.keys()]], type: QueryTypes.SELECT },
  );
  lost += acked.submissions.size - submissions.length;
  for (const s of submissions) if (acked.approvals.has(s.id) && s.status !== "approved") lost++;
  // partial: any fly-and-recharge submission in the database (acknowledged or not) without exactly its cycles
  const [{ partial }] = await sequelize.query<{ partial: string }>(
    "SELECT count(*) AS partial FROM submissions s WHERE s.method = 'fly_recharge' AND (SELECT count(*) FROM submission_cycles c WHERE c.submission_id = s.id) = 0",
    { type: QueryTypes.SELECT },
  );
  const statsNow = await statsSnapshot(sequelize);
  await rebuildAllStats(sequelize);
  const statsFresh = await statsSnapshot(sequelize);
  const keys = new Set([...statsNow.keys(), ...statsFresh.keys()]);
  let statsDiffer = 0;
  for (const key of keys) if (statsNow.get(key) !== statsFresh.get(key)) statsDiffer++;
  return { lost, partial: Number(partial), statsRows: statsFresh.size, statsDiffer };
}

/** board_stats by key, every column but the time it was computed */
async function statsSnapshot(sequelize: Sequelize): Promise<Map<string, string>> {
  const rows = await sequelize.query<Record<string, unknown>>("SELECT * FROM board_stats", { type: QueryTypes.SELECT });
  return new Map(
    rows.map((row) => {
      const { computed_at: _computed, ...rest } = row;
      return [`${row.board_revision_id}/${row.firmware_family_id}/${row.quantity}`, JSON.stringify(rest)];
    }),
  );
}
