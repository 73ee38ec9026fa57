import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { loadConfig, StartRefused, startProblem, type AppConfig } from './config';
import { seedDemo } from './demo-seed';
import { projectRoot } from './project-root';

const EXAMPLES = join(projectRoot(import.meta.url), 'examples');

/** Builds the app, seeds the demo lab into an empty database (unless DUBITO_DEMO=0) and listens on PORT. */
export async function serve(overrides: Partial<AppConfig> = {}) {
  const env = process.env;
  const loaded = loadConfig(env, overrides);
  const problem = startProblem(loaded);
  if (problem) throw new StartRefused(`refusing to start: ${problem}`);
  const handle = await createApp(loaded);
  const { config, services } = handle;
  const empty = services.budgets.count() === 0 && services.accounts.list().length === 0;
  if (empty && env.DUBITO_DEMO !== '0') {
    await seedDemo(handle.services, { examplesDir: env.DUBITO_EXAMPLES ?? EXAMPLES, log: config.log });
  }
  // Loading the engine in the workers takes a second or two of CPU; say when it is done (the API benchmark waits for it).
  void handle.pool.warm().then((ok) => ok && config.log('compute workers ready'));
  const port = Number(env.PORT ?? 3000);
  const host = env.HOST ?? '0.0.0.0';
  const server = handle.app.listen(port, host, () => config.log(`listening on http://${host === '0.0.0.0' ? 'localhost' : host}:${port} (database ${config.dbFile})`));
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    server.close();
    await handle.close();
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
  return { handle, server };
}

// Run as a script (tsx server/main.ts); in the build this module is part of start.js, which serves by itself.
if (process.argv[1] && /main\.ts$/.test(process.argv[1]) && fileURLToPath(import.meta.url) === process.argv[1]) {
  serve().catch((e) => {
    console.error('[dubito] could not start:', e instanceof StartRefused ? e.message : e);
    process.exit(1);
  });
}
