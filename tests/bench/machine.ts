// What every `npm run bench` script shares: the fixed CPU loop printed beside the figures (the
// machine's speed varies through the day), and a child process timed with its peak memory.
import { spawnSync } from "node:child_process";

/** A fixed CPU loop (3·10^8 steps of integer arithmetic), the machine's yardstick beside every figure. */
export function cpuLoopSeconds(): number {
  const t0 = performance.now();
  let x = 0;
  for (let i = 0; i < 3e8; i++) x = (x + i * 7) | 0;
  if (x === 1) console.log("");
  return (performance.now() - t0) / 1000;
}

export const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)]!;
export const round = (v: number, d = 3) => Number(v.toFixed(d));

/**
 * Wall seconds and peak memory (max RSS of the whole process, MB) of a child process, via GNU time
 * when present (else the peak is null).
 */
export function timedChild(
  cmd: string,
  args: string[],
  cwd: string,
): { s: number; maxRssMb: number | null; stdout: string } {
  const gnuTime = "/usr/bin/time";
  const useTime = spawnSync(gnuTime, ["-f", "%M", "true"]).status === 0;
  const t0 = performance.now();
  const r = useTime
    ? spawnSync(gnuTime, ["-f", "maxrss_kb %M", cmd, ...args], { cwd, encoding: "utf8", maxBuffer: 1 << 28 })
    : spawnSync(cmd, args, { cwd, encoding: "utf8", maxBuffer: 1 << 28 });
  const s = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(" ")} exited ${r.status}: ${r.stderr}`);
  const m = /maxrss_kb (\d+)/.exec(r.stderr ?? "");
  return { s, maxRssMb: m ? Math.round(Number(m[1]) / 1024) : null, stdout: r.stdout };
}
