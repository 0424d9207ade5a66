// `npm run test:soak`: the unit suite five times in a row while a CPU burner keeps every core busy, then, still
// beside the burner, the backup import fuzzing at its long count (10 000 cases). A suite that only passes on an idle machine
// is waiting for time, not for conditions. Prints per-run pass/fail counts and durations, then one final line.
//   RODSIDE_SOAK_RUNS   runs of the unit suite (default 5)
//   RODSIDE_FUZZ_RUNS   import fuzz cases (default 10000)
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';

const runs = Number(process.env.RODSIDE_SOAK_RUNS ?? 5);
const fuzzRuns = Number(process.env.RODSIDE_FUZZ_RUNS ?? 10000);
const dir = '.tmp/soak';
rmSync(dir, { recursive: true, force: true });
mkdirSync(dir, { recursive: true });

// The burner: one child process with a worker thread per core, each doing floating-point work until killed.
const cores = typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
const burnerCode = `
const { Worker } = require('node:worker_threads');
const n = Number(process.argv[1]);
const spin = 'let x = 0; for (;;) { for (let i = 1; i < 1e6; i++) x += Math.sqrt(i) * Math.sin(i); if (x === 42) console.log(x); }';
for (let i = 0; i < n; i++) new Worker(spin, { eval: true });
`;
const burner = spawn(process.execPath, ['-e', burnerCode, String(cores)], { stdio: 'ignore' });
console.log(`soak: CPU burner pid ${burner.pid} on ${cores} core(s); ${runs} unit runs; import fuzz at ${fuzzRuns} cases`);

function stopBurner() {
  if (burner.exitCode === null && burner.signalCode === null) burner.kill('SIGKILL');
}
process.on('exit', stopBurner);
process.on('SIGINT', () => { stopBurner(); process.exit(130); });

function vitest(label, args, env, report) {
  const started = Date.now();
  return new Promise((resolve) => {
    const child = spawn('npx', ['vitest', 'run', '--config', 'vitest.config.ts', '--reporter=dot', '--reporter=json', `--outputFile.json=${report}`, ...args], {
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let tail = '';
    const keep = (chunk) => { tail = (tail + chunk.toString()).slice(-4000); };
    child.stdout.on('data', keep);
    child.stderr.on('data', keep);
    child.on('close', (code) => {
      const seconds = (Date.now() - started) / 1000;
      let passed = 0, failed = 0, failures = [];
      if (existsSync(report)) {
        const j = JSON.parse(readFileSync(report, 'utf8'));
        passed = j.numPassedTests ?? 0;
        failed = j.numFailedTests ?? 0;
        for (const file of j.testResults ?? []) {
          for (const t of file.assertionResults ?? []) if (t.status === 'failed') failures.push(`${t.fullName}: ${(t.failureMessages ?? []).join(' ').split('\n')[0]}`);
        }
      }
      const ok = code === 0 && failed === 0 && passed > 0;
      resolve({ label, ok, code, passed, failed, seconds, failures, tail });
    });
  });
}

function line(r) {
  return `${r.label}: ${r.ok ? 'PASS' : 'FAIL'}, ${r.passed} passed, ${r.failed} failed, ${r.seconds.toFixed(1)} s`;
}

const results = [];
for (let i = 1; i <= runs; i++) {
  const r = await vitest(`run ${i}/${runs}`, [], {}, `${dir}/run-${i}.json`);
  console.log(line(r));
  if (!r.ok) {
    for (const f of r.failures.slice(0, 10)) console.log(`  ✗ ${f}`);
    if (r.failures.length === 0) console.log(r.tail);
  }
  results.push(r);
}
// After the unit runs rather than beside them: two vitest processes on top of the burner would measure the
// machine, not the tests.
const f = await vitest(`import fuzz (${fuzzRuns} cases)`, ['tests/unit/store/backup.test.ts', '-t', 'every corruption'], { RODSIDE_FUZZ_RUNS: String(fuzzRuns) }, `${dir}/fuzz.json`);
console.log(line(f));
if (!f.ok) {
  for (const x of f.failures.slice(0, 5)) console.log(`  ✗ ${x}`);
  if (f.failures.length === 0) console.log(f.tail);
}
stopBurner();

const good = results.filter((r) => r.ok).length;
const secs = results.map((r) => r.seconds.toFixed(0)).join(', ');
console.log(`soak: ${good}/${runs} unit runs passed under load (${secs} s); import fuzz ${fuzzRuns} cases ${f.ok ? 'passed' : 'FAILED'} (${f.seconds.toFixed(0)} s)`);
process.exit(good === runs && f.ok ? 0 : 1);
