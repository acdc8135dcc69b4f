import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';

/** Listens on host:port (0 = any free port) and resolves with the port actually bound. */
export function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error): void => reject(error);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/** Stops accepting connections and drops idle keep-alive ones, so that closing never hangs. */
export function closeServer(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((error) => (error ? reject(error) : resolve()));
    server.closeAllConnections();
  });
}

/** `http://host:port`, with brackets around an IPv6 host. */
export function httpUrl(host: string, port: number): string {
  return `http://${host.includes(':') ? `[${host}]` : host}:${port}`;
}
