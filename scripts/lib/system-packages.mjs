// Installs the Debian packages Pollenpact needs (PostgreSQL + PostGIS, Chromium for
// browser tests) when they are missing. Runs apt-get only as root; otherwise it says
// exactly what to install and stops.
import { existsSync, readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { log } from './log.mjs';

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;
let aptUpdated = false;

function aptInstall(packages) {
  if (!isRoot()) {
    throw new Error(`Missing system packages. Please run as root: apt-get update && apt-get install -y ${packages.join(' ')}`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    log(`apt-get update (to install ${packages.join(', ')})`);
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    aptUpdated = true;
  }
  log(`apt-get install ${packages.join(' ')}`);
  execFileSync('apt-get', ['install', '-y', '-qq', ...packages], { stdio: 'inherit', env });
}

/** Directory of the newest installed PostgreSQL server binaries, e.g. /usr/lib/postgresql/15/bin. */
export function postgresBinDir() {
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return null;
  const versions = readdirSync(root)
    .filter((v) => existsSync(`${root}/${v}/bin/initdb`))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? `${root}/${versions[0]}/bin` : null;
}

function postgisInstalled(version) {
  return existsSync(`/usr/share/postgresql/${version}/extension/postgis.control`);
}

/** Ensures a PostgreSQL server with PostGIS is installed; returns its bin directory. */
export function ensurePostgresInstalled() {
  let bin = postgresBinDir();
  if (!bin) {
    aptInstall(['postgresql', 'postgresql-contrib']);
    bin = postgresBinDir();
  }
  const version = bin.split('/').at(-2);
  if (!postgisInstalled(version)) aptInstall([`postgresql-${version}-postgis-3`]);
  return bin;
}

export function ensureChromiumInstalled() {
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  aptInstall(['chromium']);
  return '/usr/bin/chromium';
}

/** Fonts pdfkit and Chromium can fall back on; Work Sans itself comes from npm. */
export { isRoot };
