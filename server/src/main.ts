import { loadConfig } from './config/config.js';
import { createApp } from './bootstrap.js';

async function main(): Promise<void> {
  const config = loadConfig();
  const app = await createApp(config);
  try {
    await app.listen(config.PORT, config.HOST);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EADDRINUSE') {
      console.error(`Port ${config.PORT} on ${config.HOST} is already in use; set PORT to another port.`);
      await app.close();
      process.exit(2);
    }
    throw error;
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
