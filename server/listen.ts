import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { localUrl, type ServerConfig } from './config';

/**
 * Listens on `config.port` and, once listening, records the port the server really got (PORT=0 picks a free
 * one) in `config`; without PUBLIC_URL the public origin follows it, so every link handed out reaches this
 * server. The app reads `config` at each request, so the change holds from the first request on.
 */
export function listenOn(app: Express, config: ServerConfig, host?: string): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = host ? app.listen(config.port, host) : app.listen(config.port);
    server.once('error', reject);
    server.once('listening', () => {
      server.off('error', reject);
      config.port = (server.address() as AddressInfo).port;
      if (!config.publicUrlFixed) config.publicUrl = localUrl(config.port);
      resolve(server);
    });
  });
}
