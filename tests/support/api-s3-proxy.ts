// A TCP proxy in front of the S3 fake that a test can cut: the store becomes
// unreachable (connections reset, new ones refused) without stopping the fake
// the other test files share.
import net from 'node:net';

export interface CuttableProxy {
  endpoint: string;
  /** Bytes forwarded from clients to the store so far. */
  readonly bytesUp: number;
  /** Resets every open connection and refuses new ones. */
  cut(): Promise<void>;
  /** Accepts connections again (same port). */
  restore(): Promise<void>;
  /** Calls cut() once `bytes` more have gone up. */
  cutAfter(bytes: number): Promise<void>;
  close(): Promise<void>;
}

export async function cuttableProxy(target: string): Promise<CuttableProxy> {
  const { hostname, port } = new URL(target);
  const sockets = new Set<net.Socket>();
  let bytesUp = 0;
  let watchers: { at: number; fire: () => void }[] = [];
  const server = net.createServer((client) => {
    const upstream = net.connect(Number(port), hostname);
    sockets.add(client);
    sockets.add(upstream);
    client.on('data', (d) => {
      bytesUp += d.length;
      const due = watchers.filter((w) => bytesUp >= w.at);
      watchers = watchers.filter((w) => bytesUp < w.at);
      for (const w of due) w.fire();
    });
    client.pipe(upstream);
    upstream.pipe(client);
    const end = () => {
      client.destroy();
      upstream.destroy();
      sockets.delete(client);
      sockets.delete(upstream);
    };
    client.on('error', end).on('close', end);
    upstream.on('error', end).on('close', end);
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const proxyPort = (server.address() as net.AddressInfo).port;
  const listening = () => server.listening;
  const proxy: CuttableProxy = {
    endpoint: `http://127.0.0.1:${proxyPort}`,
    get bytesUp() {
      return bytesUp;
    },
    async cut() {
      for (const s of sockets) s.resetAndDestroy();
      sockets.clear();
      if (listening()) await new Promise<void>((r) => server.close(() => r()));
    },
    async restore() {
      if (!listening()) await new Promise<void>((r) => server.listen(proxyPort, '127.0.0.1', r));
    },
    cutAfter(bytes) {
      return new Promise((resolve) => watchers.push({ at: bytesUp + bytes, fire: () => void proxy.cut().then(resolve) }));
    },
    async close() {
      await proxy.cut();
    },
  };
  return proxy;
}
