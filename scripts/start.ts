// npm start: build the client when dist/ is missing or older than its sources, then migrate, seed
// the demo on an empty database and serve the API and the client on PORT.
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

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

function buildClient(): Promise<void> {
  return new Promise((resolvePromise, reject) => {
    const child = spawn('npx', ['vite', 'build'], { cwd: root, stdio: 'inherit' });
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolvePromise() : reject(new Error(`vite build exited with code ${code}`))));
  });
}

// Run only as the entry point, so a test can import the helpers above.
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  if (clientBuildNeeded(root)) {
    console.log('Building the client (dist/ is missing or older than its sources)…');
    await buildClient();
  }
  await import('../server/index.ts');
}
