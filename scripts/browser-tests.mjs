// Runs the browser tests. Finds Debian's Chromium (CHROMIUM_PATH, /usr/bin/chromium, PATH); when it is missing
// and we are root with apt-get, installs it from Debian; otherwise stops and names the one command to run.
import { execSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

function findChromium() {
  if (process.env.CHROMIUM_PATH && existsSync(process.env.CHROMIUM_PATH)) return process.env.CHROMIUM_PATH;
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  try {
    return execSync('command -v chromium', { encoding: 'utf8', shell: '/bin/sh' }).trim() || null;
  } catch {
    return null;
  }
}

let chromium = findChromium();
if (!chromium) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  const hasApt = spawnSync('sh', ['-c', 'command -v apt-get']).status === 0;
  if (isRoot && hasApt) {
    console.log('Chromium not found: installing it from Debian (apt-get install -y chromium)…');
    execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit', shell: '/bin/sh' });
    chromium = findChromium();
  }
  if (!chromium) {
    console.error('Browser tests need Chromium. Run: sudo apt-get update && sudo apt-get install -y chromium   (or set CHROMIUM_PATH)');
    process.exit(1);
  }
}
process.env.CHROMIUM_PATH = chromium;
const extra = process.argv.slice(2);
const r = spawnSync('npx', ['vitest', 'run', '--config', 'vitest.browser.config.ts', ...extra], { stdio: 'inherit', env: process.env });
process.exit(r.status ?? 1);
