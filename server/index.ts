// Entry point: listen on PORT with the configuration from the environment.
import { startServer } from './server.ts';

const server = await startServer({ seed: true });
console.log(`Stanchion listening on ${server.url} (database: ${server.ctx.config.databaseUrl ? 'postgres' : 'sqlite'})`);

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    server.close().then(
      () => process.exit(0),
      (e: unknown) => {
        console.error('Shutdown failed', e);
        process.exit(1);
      },
    );
  });
}
