// Gallery under load (issue 12): `npm run bench:load` (BENCH_SECONDS=30, BENCH_CONNECTIONS=50).
// Builds a temporary data folder (migrations, demo catalogue and members, BENCH_STRIPS published
// strips with 4 bands each), starts the real app and a bare Express endpoint as two child
// processes on loopback, and drives each with autocannon from this process: GET /api/strips,
// a colour search, the home page, the bare endpoint. After a 3 s warm-up per target (not
// counted), everything is run twice, identically; the app's RSS is read from /proc before,
// between and after; the JSON figures are the second run's, rssGrowthPct is over the second run. Prints figures; the last line is one
// JSON object. Targets from the issue: ratio >= 0.5, p99 <= 100 ms, 0 errors, RSS growth <= 20 %.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import autocannon from "autocannon";
import SQLite from "better-sqlite3";
import { srgbToLab } from "../shared/colour";
import { openDatabase } from "../server/db/client";
import { migrateToLatest } from "../server/db/migrate";
import { seedDemo } from "../server/demo/seed";
import { seededRandom } from "../server/demo/seeded-random";

const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const STRIPS = Number(process.env.BENCH_STRIPS ?? 2000);
const APP_PORT = Number(process.env.BENCH_APP_PORT ?? 3291);
const BARE_PORT = Number(process.env.BENCH_BARE_PORT ?? 3292);
const HOST = "127.0.0.1"; // loopback only

const rnd = seededRandom(20261212);
const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)]!;
const hex = (r: number, g: number, b: number) => "#" + ((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1);

export async function build(dataDir: string) {
  const file = path.join(dataDir, "blendwell.sqlite");
  const db = openDatabase(file);
  await migrateToLatest(db);
  await seedDemo(db);
  const inks = await db.selectFrom("inks").select("id").execute();
  const authors = await db.selectFrom("profiles").select("user_id").execute();
  await db.destroy();
  const raw = new SQLite(file);
  raw.pragma("journal_mode = WAL");
  const insUpload = raw.prepare("insert into uploads (id, owner_id, status, mime, byte_size, created_at, updated_at) values (?, ?, 'ready', 'image/webp', 1, ?, ?)");
  const insStrip = raw.prepare(
    `insert into strips (author_id, upload_id, title, paper, tools_json, status, orientation, ink_count, saves, notes_html, created_at, updated_at, published_at)
     values (?, ?, ?, ?, '["blending brush"]', 'published', 'horizontal', ?, ?, ?, ?, ?, ?)`,
  );
  const insInk = raw.prepare("insert into strip_inks (strip_id, position, ink_id) values (?, ?, ?)");
  const insBand = raw.prepare("insert into strip_bands (strip_id, position, start_frac, end_frac, lab_l, lab_a, lab_b, hex, ink_id, delta_e) values (?, ?, ?, ?, ?, ?, ?, ?, ?, 2.5)");
  const start = Date.parse("2026-01-01T00:00:00Z");
  raw.transaction(() => {
    for (let i = 0; i < STRIPS; i++) {
      const author = pick(authors).user_id;
      const at = new Date(start + i * 60_000).toISOString();
      insUpload.run(`bench-${i}`, author, at, at);
      const chosen = new Set<number>();
      while (chosen.size < 4) chosen.add(pick(inks).id);
      const inkIds = [...chosen];
      const notes = "<p>Worked in small circles with a blending brush; the <strong>second join</strong> needed a lighter touch.</p>";
      const id = Number(insStrip.run(author, `bench-${i}`, `Load strip ${i}`, "smooth-cardstock", 4, Math.floor(rnd() * 50), notes, at, at, at).lastInsertRowid);
      inkIds.forEach((inkId, position) => insInk.run(id, position, inkId));
      for (let position = 0; position < 4; position++) {
        const [r, g, b] = [0, 0, 0].map(() => Math.floor(rnd() * 256)) as [number, number, number];
        const lab = srgbToLab(r, g, b);
        insBand.run(id, position, position / 4, (position + 1) / 4, lab.l, lab.a, lab.b, hex(r, g, b), inkIds[position]!);
      }
    }
  })();
  raw.pragma("wal_checkpoint(TRUNCATE)");
  raw.exec("analyze");
  raw.close();
}

function rssMb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, "utf8").split("\n").find((l) => l.startsWith("VmRSS:"))!;
  return Number(line.replace(/\D+/g, "")) / 1024;
}

async function waitFor(url: string, child: ChildProcess) {
  for (let i = 0; i < 600; i++) {
    if (child.exitCode !== null) throw new Error(`${url}: the server exited (${child.exitCode})`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${url} did not come up`);
}

type Figures = { rps: number; p99: number; max: number; errors: number; non2xx: number };

async function drive(url: string): Promise<Figures> {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, timeout: 10 });
  return {
    rps: Math.round(result.requests.average),
    p99: result.latency.p99,
    max: result.latency.max,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}

const targets = [
  { name: "strips", url: `http://${HOST}:${APP_PORT}/api/strips` },
  { name: "colour", url: `http://${HOST}:${APP_PORT}/api/strips?color=%23b05a7a&maxDeltaE=10` },
  { name: "home", url: `http://${HOST}:${APP_PORT}/` },
  { name: "bare", url: `http://${HOST}:${BARE_PORT}/bare` },
] as const;

async function main() {
  if (!existsSync("dist/index.html")) {
    console.log("Building the client for the home page…");
    if (spawnSync("npx", ["vite", "build", "--logLevel", "warn"], { stdio: "inherit" }).status !== 0) process.exit(1);
  }
  const dataDir = mkdtempSync(path.join(os.tmpdir(), "blendwell-load-"));
  const children: ChildProcess[] = [];
  try {
    console.log(`machine: ${os.cpus().length} cores, load average ${os.loadavg().map((n) => n.toFixed(1)).join(", ")} (shared: other work slows every figure)`);
    await build(dataDir);
    console.log(`data: ${STRIPS} published strips with 4 bands each; ${CONNECTIONS} connections, ${SECONDS} s per target, two identical runs`);
    const env = { ...process.env, PORT: String(APP_PORT), DATA_DIR: dataDir, APP_URL: `http://localhost:${APP_PORT}`, DEMO_MODE: "false", LOG_LEVEL: "warn", MALLOC_ARENA_MAX: "2" };
    // node --import tsx: one process, so /proc/<pid> is the server itself.
    // BENCH_NODE_ARGS, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof", to profile the app under load.
    const nodeArgs = (process.env.BENCH_NODE_ARGS ?? "").split(" ").filter(Boolean);
    const app = spawn(process.execPath, [...nodeArgs, "--import", "tsx", "server/index.ts"], { env, stdio: ["ignore", "ignore", "inherit"] });
    const bareCode = `const express = require("express"); const app = express(); app.get("/bare", (_q, r) => { r.json({ ok: true }); }); app.listen(${BARE_PORT}, "${HOST}");`;
    const bare = spawn(process.execPath, ["-e", bareCode], { stdio: ["ignore", "ignore", "inherit"] });
    children.push(app, bare);
    await waitFor(`http://${HOST}:${APP_PORT}/api/health`, app);
    await waitFor(`http://${HOST}:${BARE_PORT}/bare`, bare);

    // Warm-up (common benchmarking practice): JIT, SQLite page cache, module loading. Not counted.
    for (const target of targets) await autocannon({ url: target.url, connections: 10, duration: 3 });
    const rss = [rssMb(app.pid!)];
    const runs: Record<string, Figures>[] = [];
    for (let run = 1; run <= 2; run++) {
      const figures: Record<string, Figures> = {};
      for (const target of targets) {
        figures[target.name] = await drive(target.url);
        const f = figures[target.name]!;
        console.log(`run ${run} ${target.name.padEnd(6)} ${String(f.rps).padStart(6)} req/s  p99 ${String(f.p99).padStart(4)} ms  max ${String(f.max).padStart(5)} ms  errors ${f.errors}  non-2xx ${f.non2xx}`);
      }
      runs.push(figures);
      rss.push(rssMb(app.pid!));
      console.log(`run ${run} app RSS ${rss[run - 1]!.toFixed(0)} MB -> ${rss[run]!.toFixed(0)} MB`);
    }
    const last = runs[1]!;
    const errors = runs.reduce((n, r) => n + Object.values(r).reduce((m, f) => m + f.errors + f.non2xx, 0), 0);
    const summary = {
      stripsRps: last.strips!.rps,
      bareRps: last.bare!.rps,
      ratio: Math.round((last.strips!.rps / last.bare!.rps) * 100) / 100,
      stripsP99Ms: last.strips!.p99,
      colourRps: last.colour!.rps,
      colourP99Ms: last.colour!.p99,
      homeRps: last.home!.rps,
      errors,
      rssBeforeMb: Math.round(rss[0]!),
      rssAfterRun1Mb: Math.round(rss[1]!),
      rssAfterRun2Mb: Math.round(rss[2]!),
      // Growth over the second identical run: memory that keeps growing is a leak.
      rssGrowthPct: Math.round(((rss[2]! - rss[1]!) / rss[1]!) * 1000) / 10,
    };
    const met = summary.ratio >= 0.5 && summary.stripsP99Ms <= 100 && errors === 0 && summary.rssGrowthPct <= 20;
    console.log(`targets (ratio >= 0.5, p99 <= 100 ms, 0 errors, RSS growth <= 20 %): ${met ? "met" : "NOT met"}`);
    console.log(JSON.stringify(summary));
  } finally {
    for (const c of children) c.kill("SIGTERM");
    await new Promise((r) => setTimeout(r, 500));
    rmSync(dataDir, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) await main();
