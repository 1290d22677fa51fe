import net from 'node:net';

/**
 * A TCP relay to `target` on a loopback port that a test can cut and restore:
 * `stop()` resets every open connection and refuses new ones, as a stopped
 * PostgreSQL looks to its clients; `start()` listens on the same port again.
 * Tests use it instead of stopping the shared test cluster, which other test
 * files use at the same time.
 */
export async function startTcpProxy(target: { host: string; port: number }) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  let port = 0;

  const listen = () =>
    new Promise<void>((resolve, reject) => {
      const s = net.createServer((client) => {
        const upstream = net.connect(target.port, target.host);
        for (const sock of [client, upstream]) {
          sockets.add(sock);
          sock.on('close', () => sockets.delete(sock));
          sock.on('error', () => {
            client.destroy();
            upstream.destroy();
          });
        }
        client.pipe(upstream).pipe(client);
      });
      s.once('error', reject);
      s.listen(port, '127.0.0.1', () => {
        port = (s.address() as net.AddressInfo).port;
        server = s;
        resolve();
      });
    });

  await listen();
  return {
    get port() {
      return port;
    },
    async stop() {
      const s = server;
      server = null;
      for (const sock of sockets) sock.resetAndDestroy();
      if (s) await new Promise<void>((resolve) => s.close(() => resolve()));
    },
    start: listen,
  };
}
