// Entry point: listen on PORT with the configuration from the environment.
import { startServer } from './server.ts';

const server = await startServer({ seed: true });
server.ctx.log.info(
  `Stanchion listening on ${server.url} (database: ${server.ctx.config.databaseUrl ? 'postgres' : 'sqlite'})`,
);

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    server.close().then(
      () => process.exit(0),
      (e: unknown) => {
        server.ctx.log.error({ err: e }, 'shutdown failed');
        process.exit(1);
      },
    );
  });
}
