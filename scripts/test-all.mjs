// `npm test`: type check, lint, unit and reference tests, production build with size report, browser tests in
// Chromium, then in WebKit (WebKitGTK under the C locale).
// Prints one closing line "N passed, N failed" over every test that ran.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, existsSync, rmSync } from 'node:fs';

const reportDir = '.tmp/test-reports';
rmSync(reportDir, { recursive: true, force: true });
mkdirSync(reportDir, { recursive: true });

const steps = [
  { name: 'type check', cmd: ['npm', 'run', '--silent', 'typecheck'] },
  { name: 'lint', cmd: ['npm', 'run', '--silent', 'lint'] },
  { name: 'unit and reference tests', cmd: ['npx', 'vitest', 'run', '--config', 'vitest.config.ts', '--reporter=default', '--reporter=json', `--outputFile.json=${reportDir}/unit.json`], report: `${reportDir}/unit.json` },
  { name: 'build', cmd: ['npm', 'run', '--silent', 'build'] },
  { name: 'browser tests', cmd: ['node', 'scripts/browser-tests.mjs', '--reporter=default', '--reporter=json', `--outputFile.json=${reportDir}/browser.json`], report: `${reportDir}/browser.json` },
  { name: 'WebKit browser tests', cmd: ['node', 'scripts/webkit-tests.mjs', '--reporter=default', '--reporter=json', `--outputFile.json=${reportDir}/webkit.json`], report: `${reportDir}/webkit.json` },
];

let passed = 0;
let failed = 0;
let skipped = 0;
let ok = true;
const started = Date.now();
for (const step of steps) {
  const t0 = Date.now();
  console.log(`\n▶ ${step.name}`);
  const r = spawnSync(step.cmd[0], step.cmd.slice(1), { stdio: 'inherit', env: process.env });
  if (step.report && existsSync(step.report)) {
    const j = JSON.parse(readFileSync(step.report, 'utf8'));
    passed += j.numPassedTests ?? 0;
    failed += j.numFailedTests ?? 0;
    skipped += (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0);
  }
  console.log(`◀ ${step.name}: ${r.status === 0 ? 'ok' : 'FAILED'} (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
  if (r.status !== 0) {
    ok = false;
    if (!step.report) failed += 1; // a failed type check or build counts as a failure
    break;
  }
}
console.log(`\nAll steps ${ok ? 'passed' : 'stopped at a failure'} in ${((Date.now() - started) / 1000).toFixed(0)} s.`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(ok && failed === 0 ? 0 : 1);
