import { existsSync } from 'node:fs';
import { isRoot, log, runSync } from './run';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Debian's chromium (and poppler-utils for PDF pictures), installed with apt when absent and root. */
export function ensureChromium(): { ok: boolean; message: string } {
  if (existsSync(CHROMIUM) && existsSync('/usr/bin/pdftoppm')) return { ok: true, message: '' };
  if (!isRoot()) {
    return existsSync(CHROMIUM)
      ? { ok: true, message: '' }
      : { ok: false, message: 'Chromium is missing: run `sudo apt-get install chromium poppler-utils`' };
  }
  log('installing Debian\'s chromium and poppler-utils for the end-to-end tests ...');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  try {
    runSync('apt-get', ['update'], { env });
    runSync('apt-get', ['install', '-y', 'chromium', 'poppler-utils'], { env });
  } catch (err) {
    return { ok: false, message: (err as Error).message.split('\n')[0] };
  }
  return existsSync(CHROMIUM) ? { ok: true, message: '' } : { ok: false, message: 'chromium did not install' };
}
