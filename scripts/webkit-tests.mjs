// Runs the WebKit browser tests (tests/browser/webkit) on Debian's WebKitGTK: WebKitWebDriver (package
// webkit2gtk-driver) under xvfb-run (package xvfb), driving the MiniBrowser of libwebkit2gtk-4.1-0.
// When a package is missing and we are root with apt-get, installs it from Debian; otherwise stops and names the
// one command to run. The tests run under the C locale (navigator.language === 'C'), which Intl refuses.
import { execSync, spawnSync } from 'node:child_process';

const INSTALL = 'apt-get update && apt-get install -y webkit2gtk-driver xvfb';

function has(cmd) {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
}
function miniBrowser() {
  const r = spawnSync('dpkg', ['-L', 'libwebkit2gtk-4.1-0'], { encoding: 'utf8' });
  return r.status === 0 ? (r.stdout.split('\n').find((l) => l.endsWith('/MiniBrowser')) ?? null) : null;
}
const ready = () => has('WebKitWebDriver') && has('xvfb-run') && miniBrowser() !== null;

if (!ready()) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot && has('apt-get')) {
    console.log('WebKitGTK WebDriver or xvfb not found: installing them from Debian (apt-get install -y webkit2gtk-driver xvfb)…');
    execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq webkit2gtk-driver xvfb', { stdio: 'inherit', shell: '/bin/sh' });
  }
  if (!ready()) {
    console.error(`WebKit browser tests need WebKitGTK's WebDriver and a virtual display. Run: sudo ${INSTALL.replace('&& apt-get', '&& sudo apt-get')}`);
    process.exit(1);
  }
}

const extra = process.argv.slice(2);
// glibc's C locale: WebKit then reports navigator.language === 'C' (plain LANG=C is mapped to en-US by WebKit).
const env = { ...process.env, LANG: 'C.UTF-8', LC_ALL: 'C.UTF-8' };
const r = spawnSync('npx', ['vitest', 'run', '--config', 'vitest.webkit.config.ts', ...extra], { stdio: 'inherit', env });
process.exit(r.status ?? 1);
