// Runs the mail catcher on its own: `tsx fakes/mail/main.ts`. Ports follow DESIGN.md's fixed interface.
import { startMailCatcher } from './server';

function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number (0-65535), got "${raw}"`);
  }
  return port;
}

const catcher = await startMailCatcher({
  smtpPort: portFromEnv('MAIL_SMTP_PORT', 1025),
  webPort: portFromEnv('MAIL_WEB_PORT', 1080),
});
console.log(`mail catcher: SMTP on 127.0.0.1:${catcher.smtpPort}, inbox at ${catcher.webUrl}`);

let stopping = false;
async function stop(signal: NodeJS.Signals): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`mail catcher: ${signal}, closing`);
  await catcher.close();
  process.exit(0);
}
process.on('SIGINT', (signal) => void stop(signal));
process.on('SIGTERM', (signal) => void stop(signal));
