/**
 * The development mail catcher as its own process, for `npm start` and `npm test`.
 *
 *   node --import tsx server/scripts/mail-catcher.ts [--host 127.0.0.1] [--smtp-port 0] [--http-port 0] [--max-messages 500]
 *
 * When both servers listen it prints exactly one JSON line on stdout, e.g.
 *   {"ready":true,"host":"127.0.0.1","smtpPort":40123,"httpPort":40124,"url":"http://127.0.0.1:40124"}
 * and nothing else on stdout; notes about caught mail go to stderr. SIGINT or SIGTERM stops it (exit 0).
 */
import { parseArgs } from 'node:util';
import { startCaughtMailApi, startMailCatcher } from '@/server/mail/mail-catcher';

function portArg(value: string | undefined, name: string): number {
  const n = Number(value ?? '0');
  if (!Number.isInteger(n) || n < 0 || n > 65535)
    throw new Error(`--${name} must be a port number (0 picks a free one); got ${value}.`);
  return n;
}

async function main() {
  const { values } = parseArgs({
    options: {
      host: { type: 'string', default: '127.0.0.1' },
      'smtp-port': { type: 'string', default: '0' },
      'http-port': { type: 'string', default: '0' },
      'max-messages': { type: 'string', default: '500' },
    },
    strict: true,
  });
  const host = values.host;
  const maxMessages = Number(values['max-messages']);

  const catcher = await startMailCatcher({
    host,
    port: portArg(values['smtp-port'], 'smtp-port'),
    maxMessages,
    onMessage: (mail) => console.error(`[mail-catcher] caught "${mail.subject}" for ${mail.to.join(', ')}`),
  });
  const api = await startCaughtMailApi(catcher, { host, port: portArg(values['http-port'], 'http-port') }).catch(
    async (err: unknown) => {
      await catcher.close();
      throw err;
    },
  );

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.error(`[mail-catcher] ${signal}: closing`);
    setTimeout(() => process.exit(1), 5000).unref();
    void Promise.all([api.close(), catcher.close()]).then(() => process.exit(0));
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));

  process.stdout.write(JSON.stringify({ ready: true, host, smtpPort: catcher.port, httpPort: api.port, url: api.url }) + '\n');
}

main().catch((err: unknown) => {
  console.error('[mail-catcher] could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
