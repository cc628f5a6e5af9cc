import { parseEnv, EnvError } from './env';
import { boot } from './boot';
import { DEMO_PEOPLE } from './db/demo-world';

// listen + graceful shutdown only; everything else is in boot.ts and app.ts.
async function main() {
  let env;
  try {
    env = parseEnv();
  } catch (err) {
    if (err instanceof EnvError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const dev = process.argv.includes('--dev');
  const running = await boot({ env, dev });
  printWelcome(running.url, running.mailWebUrl, running.payments?.url ?? null, env.DEMO_PASSWORD);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n[kitlane] ${signal}: stopping…`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    await running.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

function printWelcome(url: string, mailUrl: string | null, paymentsUrl: string | null, password: string) {
  const byRole = (role: string) => DEMO_PEOPLE.filter((p) => p.roles.includes(role as never)).map((p) => p.email);
  console.log(`
Kitlane is running
  app           ${url}
  mail inbox    ${mailUrl ?? '(external SMTP)'}
  payment fake  ${paymentsUrl ?? '(external processor)'}
Demo logins (password: ${password})
  admin         ${byRole('admin').join(', ')}
  songwriters   ${byRole('songwriter').join(', ')}
  drummers      ${byRole('drummer').join(', ')}
  engineers     ${byRole('engineer').join(', ')}
Press Ctrl-C to stop.`);
}

main().catch((err) => {
  console.error('[kitlane] failed to start:', err);
  process.exit(1);
});
