import { Logger } from '@nestjs/common';
import { createApp } from './app.factory';
import { ConfigError, parseConfig } from './config/app-config';

/** `node api/dist/main.js`: parse the environment, build the app, listen. Migrations run separately (database CLI). */
async function main(): Promise<void> {
  let config;
  try {
    config = parseConfig(process.env);
  } catch (e) {
    if (e instanceof ConfigError) {
      process.stderr.write(`${e.message}\n`);
      process.exit(1);
    }
    throw e;
  }
  const app = await createApp(config);
  app.enableShutdownHooks();
  await app.listen(config.port, config.host);
  new Logger('sagline').log(`api listening on http://${config.host}:${config.port} (public URL ${config.publicUrl}, ${config.nodeEnv})`);
}

main().catch((e: unknown) => {
  process.stderr.write(`The api failed to start: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exit(1);
});
