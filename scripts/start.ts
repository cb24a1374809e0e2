// npm start: make sure the built client is there, then migrate, seed the demo on an empty database and
// serve the API and the client on PORT. With the dev dependencies installed (a clone after
// `npm install`) the client is built first when dist/ is missing or older than its sources. A production
// install (`npm ci --omit=dev`) has no Vite: it serves the dist/ built beforehand with `npm run build`.
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { pino } from 'pino';

const root = fileURLToPath(new URL('..', import.meta.url));
const CLIENT_SOURCES = ['src', 'shared', 'index.html', 'vite.config.ts', 'public'];

/** Newest modification time (ms) of a file or of any file under a folder; 0 when absent. */
export function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

export function clientBuildNeeded(rootDir: string): boolean {
  const built = join(rootDir, 'dist', 'index.html');
  if (!existsSync(built)) return true;
  const sources = Math.max(...CLIENT_SOURCES.map((p) => newestMtime(resolve(rootDir, p))));
  return sources > statSync(built).mtimeMs;
}

/** Vite's command-line script, or null on a production install, which has no dev dependencies. */
export function viteScript(rootDir: string): string | null {
  const pkg = join(rootDir, 'node_modules', 'vite', 'package.json');
  if (!existsSync(pkg)) return null;
  const { bin } = JSON.parse(readFileSync(pkg, 'utf8')) as { bin: { vite: string } };
  return join(dirname(pkg), bin.vite);
}

/**
 * What start does about the client: build it when it must and can; otherwise serve what dist/ holds
 * ('stale' when the sources are newer but there is no Vite to rebuild them), or stop when there is none.
 */
export function clientStep(rootDir: string, canBuild: boolean): 'build' | 'serve' | 'serve-stale' | 'missing' {
  if (!clientBuildNeeded(rootDir)) return 'serve';
  if (canBuild) return 'build';
  return existsSync(join(rootDir, 'dist', 'index.html')) ? 'serve-stale' : 'missing';
}

function buildClient(vite: string): Promise<void> {
  return new Promise((resolvePromise, reject) => {
    // The local Vite, run by this Node: never a download through npx.
    const child = spawn(process.execPath, [vite, 'build'], { cwd: root, stdio: 'inherit' });
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolvePromise() : reject(new Error(`vite build exited with code ${code}`)),
    );
  });
}

// Run only as the entry point, so a test can import the helpers above.
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const log = pino({ level: process.env.LOG_LEVEL ?? 'info', name: 'start' });
  const vite = viteScript(root);
  const step = clientStep(root, vite !== null);
  if (step === 'missing') {
    log.fatal(
      'dist/ is missing and Vite is not installed (a production install): run `npm run build` where the dev dependencies are installed and ship dist/, or run `npm install`',
    );
    process.exit(1);
  }
  if (step === 'serve-stale')
    log.warn('dist/ is older than the client sources and Vite is not installed: serving the existing build');
  if (step === 'build' && vite) {
    log.info('Building the client (dist/ is missing or older than its sources)…');
    await buildClient(vite);
  }
  await import('../server/index.ts');
}
