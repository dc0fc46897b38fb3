// A throwaway PostgreSQL cluster for tests and benchmarks: initdb in a temp folder, started on a
// free loopback port, trust auth for the local user only, stopped and deleted by stop().
// initdb refuses to run as root, so as root the cluster runs as the `postgres` system user (or
// PG_TEST_USER), which owns the temp folder; as any other user it runs as that user.
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

export interface Cluster {
  url: string;
  port: number;
  stop(): void;
}

function binDir(): string {
  if (process.env.PG_BIN) return process.env.PG_BIN;
  const base = "/usr/lib/postgresql";
  const versions = fs.existsSync(base) ? fs.readdirSync(base).filter((v) => fs.existsSync(path.join(base, v, "bin", "initdb"))) : [];
  if (versions.length === 0) throw new Error("PostgreSQL server binaries not found: apt-get install postgresql (or set PG_BIN)");
  versions.sort((a, b) => Number(b) - Number(a));
  return path.join(base, versions[0] as string, "bin");
}

async function portFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.createServer().once("error", () => resolve(false));
    s.listen(port, "127.0.0.1", () => s.close(() => resolve(true)));
  });
}

/** The first free port from `from` on (up to 40 tried). */
export async function freePort(from: number): Promise<number> {
  for (let p = from; p < from + 40; p++) if (await portFree(p)) return p;
  throw new Error(`no free port in ${from}-${from + 39}`);
}

export async function startCluster(opts: { port?: number; log?: (s: string) => void } = {}): Promise<Cluster> {
  const log = opts.log ?? (() => undefined);
  const bin = binDir();
  const root = process.getuid?.() === 0;
  const user = root ? (process.env.PG_TEST_USER ?? "postgres") : os.userInfo().username;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-pg-"));
  const data = path.join(dir, "data");
  if (root) execFileSync("chown", ["-R", `${user}`, dir]);
  // Run a server binary as the cluster's owner.
  const run = (cmd: string, args: string[]) => {
    const [file, argv] = root ? ["runuser", ["-u", user, "--", path.join(bin, cmd), ...args]] : [path.join(bin, cmd), args];
    const r = spawnSync(file, argv, { encoding: "utf8", cwd: dir });
    if (r.status !== 0) throw new Error(`${cmd} failed: ${r.stderr || r.stdout}`);
    return r.stdout;
  };
  // C collation: text sorts by code point, as in SQLite, so both engines order lists alike.
  run("initdb", ["-D", data, "-U", user, "--auth=trust", "--encoding=UTF8", "--locale=C", "--no-sync"]);
  const port = opts.port ?? (await freePort(Number(process.env.PG_TEST_PORT ?? 3550)));
  const settings = [
    `port = ${port}`,
    "listen_addresses = '127.0.0.1'",
    `unix_socket_directories = '${dir}'`,
    "max_connections = 300",
    // A test cluster: durability off for speed (the data is thrown away anyway).
    "fsync = off",
    "synchronous_commit = off",
    "full_page_writes = off",
    "shared_buffers = 64MB",
  ];
  fs.appendFileSync(path.join(data, "postgresql.conf"), `\n${settings.join("\n")}\n`);
  run("pg_ctl", ["-D", data, "-l", path.join(dir, "server.log"), "-w", "-t", "60", "start"]);
  const url = `postgres://${user}@127.0.0.1:${port}/postgres`;
  log(`PostgreSQL ${run("postgres", ["--version"]).trim()} on ${url} (${dir})`);
  let stopped = false;
  return {
    url,
    port,
    stop() {
      if (stopped) return;
      stopped = true;
      try {
        run("pg_ctl", ["-D", data, "-m", "immediate", "-w", "stop"]);
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
