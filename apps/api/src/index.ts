import { createApp } from './app.js';

const port = Number(process.env.PORT || 3000);
const host = process.env.HOST || '0.0.0.0';
const app = await createApp();
const server = app.httpServer().listen(port, host, () => {
  console.log(`pulsewright: API and dashboard on http://localhost:${port} (docs at /api/docs)`);
  if (app.freshDatabase)
    console.log('pulsewright: new database migrated and seeded with the Kestrel Drives demo');
});

const stop = (signal: string) => {
  console.log(`pulsewright: ${signal}, shutting down`);
  server.close(() => {
    app.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  });
};
process.on('SIGINT', () => stop('SIGINT'));
process.on('SIGTERM', () => stop('SIGTERM'));
