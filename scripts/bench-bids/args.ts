// The benchmark's command line, checked once: whole numbers in range, a bench-only database name, socket or http.
import { parseArgs } from "node:util";

/** Reads and checks the command line; exits with status 2 and a message on bad input. */
export function readBenchArgs() {
  const { values: argv } = parseArgs({
    options: {
      watchers: { type: "string", default: "200" },
      bidders: { type: "string", default: "20" },
      seconds: { type: "string", default: "20" },
      rate: { type: "string", default: "50" },
      database: { type: "string", default: "getterline_bench" },
      profile: { type: "boolean", default: false },
      "keep-logs": { type: "boolean", default: false },
      "wait-idle": { type: "string", default: "0" },
      over: { type: "string", default: "socket" },
    },
  });
  const int = (name: string, v: string | undefined, min: number, max: number) => {
    const n = Number(v);
    if (!Number.isInteger(n) || n < min || n > max) {
      console.error(`--${name} must be a whole number from ${min} to ${max}`);
      process.exit(2);
    }
    return n;
  };
  const W = int("watchers", argv.watchers, 1, 5000);
  const M = int("bidders", argv.bidders, 1, 500);
  const T = int("seconds", argv.seconds, 1, 600);
  const R = int("rate", argv.rate, 1, 10_000);
  const WAIT_IDLE = int("wait-idle", argv["wait-idle"], 0, 3600);
  const DB = argv.database!;
  if (!/^getterline_bench[a-z0-9_]*$/.test(DB)) {
    console.error("--database must start with getterline_bench");
    process.exit(2);
  }

  if (argv.over !== "socket" && argv.over !== "http") {
    console.error("--over must be socket or http");
    process.exit(2);
  }
  return { argv, W, M, T, R, WAIT_IDLE, DB };
}
